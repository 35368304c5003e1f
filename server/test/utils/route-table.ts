import { RequestMethod } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { ModulesContainer } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import type { AppAction, ProjectAction } from '@ladderwright/shared/auth';
import { ALLOWED_WHEN_ARCHIVED_KEY } from '../../src/common/decorators/allowed-when-archived.decorator';
import { IS_PUBLIC_KEY } from '../../src/common/decorators/public.decorator';
import { APP_ACTION_KEY, PROJECT_ACTION_KEY } from '../../src/common/decorators/requires-permission.decorator';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** One API route as the running app serves it, with the authorization metadata its guards read. */
export interface ApiRoute {
  method: HttpMethod;
  /** Express form, e.g. `/api/projects/:projectId/members`. */
  path: string;
  handlerName: string;
  isPublic: boolean;
  appAction: AppAction | null;
  /** The project action the project guard checks; `project.read` when the route names none. */
  projectAction: ProjectAction | null;
  params: string[];
  /** `@AllowedWhenArchived()`: a non-GET route an archived project still answers. */
  isAllowedWhenArchived: boolean;
}

const METHOD_NAMES: Partial<Record<RequestMethod, HttpMethod>> = {
  [RequestMethod.GET]: 'GET',
  [RequestMethod.POST]: 'POST',
  [RequestMethod.PUT]: 'PUT',
  [RequestMethod.PATCH]: 'PATCH',
  [RequestMethod.DELETE]: 'DELETE',
};

function joinPath(...parts: string[]): string {
  const joined = `/${parts.join('/')}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function asList(value: unknown): string[] {
  if (Array.isArray(value)) return value.map(String);
  return [typeof value === 'string' ? value : '/'];
}

interface ExpressLayer {
  route?: { path: unknown; methods: Record<string, boolean> };
}

/** Every method + path the Express router holds (what can actually be requested). */
export function expressRoutes(app: NestExpressApplication): { method: string; path: string }[] {
  const instance = app.getHttpAdapter().getInstance() as { router?: { stack: ExpressLayer[] } };
  const stack = instance.router?.stack ?? [];
  return stack.flatMap((layer) => {
    const route = layer.route;
    if (!route || typeof route.path !== 'string') return [];
    const path = route.path;
    return Object.keys(route.methods)
      .filter((method) => route.methods[method] && method !== '_all')
      .map((method) => ({ method: method.toUpperCase(), path }));
  });
}

/**
 * The application's own route table: every controller handler Nest registered, with its metadata.
 * Throws when the Express router serves an API route no controller handler accounts for.
 */
export function apiRouteTable(app: NestExpressApplication, prefix = 'api'): ApiRoute[] {
  const routes: ApiRoute[] = [];
  for (const module of app.get(ModulesContainer).values()) {
    for (const wrapper of module.controllers.values()) {
      const controller = wrapper.metatype as (new (...args: never[]) => object) | null;
      if (!controller || typeof controller !== 'function') continue;
      const controllerPaths = asList(Reflect.getMetadata(PATH_METADATA, controller));
      const prototype = controller.prototype as Record<string, unknown>;
      for (const name of Object.getOwnPropertyNames(prototype)) {
        const handler = prototype[name];
        if (name === 'constructor' || typeof handler !== 'function') continue;
        const methodPath: unknown = Reflect.getMetadata(PATH_METADATA, handler);
        if (methodPath === undefined) continue;
        const method = METHOD_NAMES[Reflect.getMetadata(METHOD_METADATA, handler) as RequestMethod];
        if (!method) throw new Error(`${controller.name}.${name}: unsupported HTTP method in the route table`);
        const read = <T>(key: string): T | undefined =>
          (Reflect.getMetadata(key, handler) as T | undefined) ??
          (Reflect.getMetadata(key, controller) as T | undefined);
        for (const base of controllerPaths) {
          for (const sub of asList(methodPath)) {
            const path = joinPath(prefix, base, sub);
            const params = [...path.matchAll(/:([A-Za-z0-9_]+)/g)].map((match) => match[1] ?? '');
            routes.push({
              method,
              path,
              handlerName: `${controller.name}.${name}`,
              isPublic: read<boolean>(IS_PUBLIC_KEY) === true,
              appAction: read<AppAction>(APP_ACTION_KEY) ?? null,
              projectAction: params.includes('projectId')
                ? (read<ProjectAction>(PROJECT_ACTION_KEY) ?? 'project.read')
                : null,
              params,
              isAllowedWhenArchived: read<boolean>(ALLOWED_WHEN_ARCHIVED_KEY) === true,
            });
          }
        }
      }
    }
  }
  const known = new Set(routes.map((route) => `${route.method} ${route.path}`));
  const docsPrefix = `/${prefix}/docs`;
  const unaccounted = expressRoutes(app).filter(
    (route) =>
      route.path.startsWith(`/${prefix}/`) &&
      !route.path.startsWith(docsPrefix) &&
      !known.has(`${route.method} ${route.path}`),
  );
  if (unaccounted.length > 0) {
    throw new Error(
      `routes served without a controller handler: ${unaccounted.map((r) => `${r.method} ${r.path}`).join(', ')}`,
    );
  }
  return routes.sort((a, b) => `${a.path} ${a.method}`.localeCompare(`${b.path} ${b.method}`));
}
