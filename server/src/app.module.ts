import { existsSync } from 'node:fs';
import { extname, join } from 'node:path';
import { type DynamicModule, Logger, type LogLevel, Module, ValidationPipe } from '@nestjs/common';
import { APP_GUARD, NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import cookieParser from 'cookie-parser';
import type { NextFunction, Request, Response } from 'express';
import helmet from 'helmet';
import { AnalysisModule } from './analysis/analysis.module';
import { withDesignSchemaComponents } from './analysis/design-schema-components';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { BenchRunsModule } from './bench-runs/bench-runs.module';
import { SESSION_COOKIE } from './auth/jwt.strategy';
import { DomainErrorFilter, RequestValidationException } from './common/filters/domain-error.filter';
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
import { ProjectsModule } from './projects/projects.module';
import { ReviewsModule } from './reviews/reviews.module';
import { SpecSheetsModule } from './spec-sheets/spec-sheets.module';
import { SimulationsModule } from './simulations/simulations.module';
import { RevisionsModule } from './revisions/revisions.module';
import { UsersModule } from './users/users.module';

export const API_PREFIX = 'api';

@Module({})
export class AppModule {
  /** Guards run in this order: session (401), account role (403), project membership (404/403). */
  static forRoot(env: AppEnv): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(env),
        DatabaseModule,
        AuditModule,
        UsersModule,
        AuthModule,
        ProjectsModule,
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
      ],
      providers: [
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
  });
  configureApp(app, env);
  return app;
}

/** Everything the running server and the e2e tests must share: prefix, middleware, pipes, filters, docs, client. */
export function configureApp(app: NestExpressApplication, env: AppEnv): void {
  app.setGlobalPrefix(API_PREFIX);
  app.disable('x-powered-by');
  // Before any route: an oversized body is refused from its Content-Length (413), unread.
  app.useBodyParser('json', { limit: env.bodyLimitBytes });
  app.useBodyParser('urlencoded', { limit: env.bodyLimitBytes, extended: false });
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
      exceptionFactory: (errors) => new RequestValidationException(errors),
    }),
  );
  app.useGlobalFilters(new DomainErrorFilter());
  setUpApiDocs(app);
  serveClient(app, env.clientDistDir);
}

function setUpApiDocs(app: NestExpressApplication): void {
  const config = new DocumentBuilder()
    .setTitle('Ladderwright API')
    .setDescription(
      'High-voltage DC supply design workbench. Sign in with POST /api/auth/sign-in; the session is the lw_session cookie.',
    )
    .setVersion('0.1.0')
    .addCookieAuth(SESSION_COOKIE)
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
  app.useStaticAssets(clientDistDir, { index: false });
  app.use((request: Request, response: Response, next: NextFunction) => {
    const isPageRequest = request.method === 'GET' || request.method === 'HEAD';
    const isApi = request.path === `/${API_PREFIX}` || request.path.startsWith(`/${API_PREFIX}/`);
    if (!isPageRequest || isApi || extname(request.path) !== '') return next();
    response.sendFile(indexHtml);
  });
}
