import { existsSync } from 'node:fs';
import { extname, join } from 'node:path';
import { type DynamicModule, Logger, type LogLevel, Module, ValidationPipe } from '@nestjs/common';
import { APP_GUARD, NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import cookieParser from 'cookie-parser';
import express, { type NextFunction, type Request, type Response } from 'express';
import helmet from 'helmet';
import { AnalysisModule } from './analysis/analysis.module';
import { withDesignSchemaComponents } from './analysis/design-schema-components';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { SessionCacheModule } from './auth/session-cache.module';
import { BenchRunsModule } from './bench-runs/bench-runs.module';
import { sessionCookieName } from './auth/jwt.strategy';
import { bodyTransformer } from './common/decorators/shallow-transform.decorator';
import { RequestShapeGuard } from './common/guards/request-shape.guard';
import { DomainErrorFilter, RequestValidationException } from './common/filters/domain-error.filter';
import { sameOriginOnly } from './common/middleware/same-origin.middleware';
import { JsonBodyGuard } from './common/guards/json-body.guard';
import { JwtAuthGuard } from './common/guards/jwt-auth.guard';
import { ProjectAccessGuard } from './projects/project-access.guard';
import { RolesGuard } from './common/guards/roles.guard';
import { ConfigModule } from './config/config.module';
import type { AppEnv } from './config/env';
import { DatabaseModule } from './database/database.module';
import { DesignsModule } from './designs/designs.module';
import { HealthModule } from './health/health.module';
import { MailModule } from './mail/mail.module';
import { PartsModule } from './parts/parts.module';
import { MemberRequestsModule } from './member-requests/member-requests.module';
import { ProjectsModule } from './projects/projects.module';
import { ReviewsModule } from './reviews/reviews.module';
import { SpecSheetsModule } from './spec-sheets/spec-sheets.module';
import { SimulationsModule } from './simulations/simulations.module';
import { CalibrationsModule } from './calibrations/calibrations.module';
import { RevisionsModule } from './revisions/revisions.module';
import { UsersModule } from './users/users.module';

export const API_PREFIX = 'api';

@Module({})
export class AppModule {
  /** Guards run in this order: body type (415), session (401), account role (403), project membership (404/403). */
  static forRoot(env: AppEnv): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(env),
        DatabaseModule,
        AuditModule,
        SessionCacheModule,
        UsersModule,
        AuthModule,
        ProjectsModule,
        MemberRequestsModule,
        HealthModule,
        MailModule,
        ReviewsModule,
        SpecSheetsModule,
        AnalysisModule,
        RevisionsModule,
        DesignsModule,
        PartsModule,
        BenchRunsModule,
        SimulationsModule,
        CalibrationsModule,
      ],
      providers: [
        { provide: APP_GUARD, useClass: JsonBodyGuard },
        { provide: APP_GUARD, useClass: JwtAuthGuard },
        { provide: APP_GUARD, useClass: RolesGuard },
        { provide: APP_GUARD, useClass: ProjectAccessGuard },
      ],
    };
  }
}

/** Builds the Nest app for `env` and applies `configureApp`; the caller migrates, then listens or inits. */
export async function createApp(
  env: AppEnv,
  options: { logger?: false | LogLevel[] } = {},
): Promise<NestExpressApplication> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(env), {
    logger: options.logger ?? ['error', 'warn', 'log'],
    // Only the JSON parser, registered in configureApp: no form-encoded bodies (see JsonBodyGuard).
    bodyParser: false,
  });
  configureApp(app, env);
  return app;
}

/** Everything the running server and the e2e tests must share: prefix, middleware, pipes, filters, docs, client. */
export function configureApp(app: NestExpressApplication, env: AppEnv): void {
  app.setGlobalPrefix(API_PREFIX);
  app.disable('x-powered-by');
  // Off unless TRUST_PROXY names the reverse proxies: then request.ip (the per-address sign-in limit, the audit's
  // client address) is the visitor's from X-Forwarded-For, not the proxy's.
  app.set('trust proxy', typeof env.trustProxy === 'object' ? [...env.trustProxy] : env.trustProxy);
  // First: a change sent by a page of another origin is refused before its body is read.
  app.use(sameOriginOnly(env));
  // Before any route: an oversized body is refused from its Content-Length (413), unread.
  app.useBodyParser('json', { limit: env.bodyLimitBytes });
  // CORS stays closed (no Access-Control-Allow-Origin at all) unless CORS_ORIGINS lists origins.
  if (env.corsOrigins.length > 0) app.enableCors({ origin: [...env.corsOrigins], credentials: true });
  // Plain http on loopback: no HSTS and no upgrade of sub-requests to https, which would break the page.
  app.use(
    helmet({
      strictTransportSecurity: env.cookieSecure,
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: env.cookieSecure ? [] : null } },
    }),
  );
  app.use(cookieParser());
  app.useGlobalPipes(
    new ValidationPipe({
      whitelist: true,
      forbidNonWhitelisted: true,
      transform: true,
      transformerPackage: bodyTransformer,
      exceptionFactory: (errors) => new RequestValidationException(errors),
    }),
  );
  // Before any pipe: no NUL, unpaired surrogate or hostile nesting reaches validation or the database.
  app.useGlobalGuards(new RequestShapeGuard());
  app.useGlobalFilters(new DomainErrorFilter());
  if (env.apiDocs) setUpApiDocs(app, sessionCookieName(env));
  serveClient(app, env.clientDistDir);
}

function setUpApiDocs(app: NestExpressApplication, cookieName: string): void {
  const config = new DocumentBuilder()
    .setTitle('Ladderwright API')
    .setDescription(
      `High-voltage DC supply design workbench. Sign in with POST /api/auth/sign-in; the session is the ${cookieName} cookie. Request bodies are JSON (uploads multipart); changes from pages of another origin are refused.`,
    )
    .setVersion('0.1.0')
    .addCookieAuth(cookieName)
    .build();
  SwaggerModule.setup(`${API_PREFIX}/docs`, app, () =>
    withDesignSchemaComponents(SwaggerModule.createDocument(app, config)),
  );
}

/** Serves the built client and answers non-API page routes with its index.html (client-side routing). */
function serveClient(app: NestExpressApplication, clientDistDir: string): void {
  const indexHtml = join(clientDistDir, 'index.html');
  if (!existsSync(indexHtml)) {
    new Logger('Client').warn(`no built client at ${clientDistDir}; only the API is served`);
    return;
  }
  // Registered before the API routes (Nest adds those at init), so it steps aside for /api paths itself:
  // an API request never costs a file-system lookup.
  const assets = express.static(clientDistDir, { index: false });
  app.use((request: Request, response: Response, next: NextFunction): void => {
    const isApi = request.path === `/${API_PREFIX}` || request.path.startsWith(`/${API_PREFIX}/`);
    const isPageRequest = request.method === 'GET' || request.method === 'HEAD';
    if (isApi || !isPageRequest) next();
    else if (extname(request.path) !== '') void assets(request, response, next);
    else response.sendFile(indexHtml);
  });
}
