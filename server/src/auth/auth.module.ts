import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { APP_ENV, type AppEnv } from '../config/env';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JwtStrategy, sessionSigningKey } from './jwt.strategy';
import { SessionsService } from './sessions.service';
import { SignInThrottleService } from './sign-in-throttle.service';

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
  ],
  controllers: [AuthController],
  providers: [
    AuthService,
    JwtStrategy,
    SessionsService,
    { provide: SignInThrottleService, useFactory: () => new SignInThrottleService() },
  ],
})
export class AuthModule {}
