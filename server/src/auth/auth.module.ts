import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import { Sequelize } from 'sequelize-typescript';
import { APP_ENV, type AppEnv } from '../config/env';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JwtStrategy, sessionSigningKey } from './jwt.strategy';
import { PostgresThrottlerStorage } from './postgres-throttler.storage';
import { SessionsService } from './sessions.service';
import { SignInDelayService } from './sign-in-delay.service';
import { SignInThrottlerGuard } from './sign-in-throttler.guard';

const MINUTE_MS = 60_000;

@Module({
  imports: [
    UsersModule,
    PassportModule,
    JwtModule.registerAsync({
      inject: [APP_ENV],
      useFactory: (env: AppEnv) => ({
        secret: sessionSigningKey(env),
        verifyOptions: { algorithms: ['HS256'] },
        signOptions: { expiresIn: env.jwtTtlS, algorithm: 'HS256' },
      }),
    }),
    // Sign-in limits per client address and over all clients, counted in PostgreSQL (shared by instances).
    ThrottlerModule.forRootAsync({
      inject: [APP_ENV, Sequelize],
      useFactory: (env: AppEnv, sequelize: Sequelize) => ({
        throttlers: [
          { name: 'address', ttl: MINUTE_MS, limit: env.signInPerAddressPerMin, blockDuration: MINUTE_MS },
          { name: 'all', ttl: MINUTE_MS, limit: env.signInPerMin, blockDuration: 10_000, getTracker: () => 'all' },
        ],
        storage: new PostgresThrottlerStorage(sequelize),
        setHeaders: false,
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [AuthService, JwtStrategy, SessionsService, SignInDelayService, SignInThrottlerGuard],
})
export class AuthModule {}
