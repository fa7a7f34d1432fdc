import { Module } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import { TypeOrmModule } from '@nestjs/typeorm';
import { authConfig, type AuthConfig } from '../config/auth.config.js';
import { RateLimitsModule } from '../rate-limits/rate-limits.module.js';
import { PostgresThrottlerStorage } from '../rate-limits/postgres-throttler.storage.js';
import { UsersModule } from '../users/users.module.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { JwtStrategy } from './jwt.strategy.js';
import { SessionsService } from './sessions.service.js';
import { signInThrottlerOptions } from './sign-in-throttle.js';
import { UserSession } from './user-session.entity.js';

@Module({
  imports: [
    UsersModule,
    RateLimitsModule,
    TypeOrmModule.forFeature([UserSession]),
    PassportModule,
    JwtModule.registerAsync({
      imports: [ConfigModule.forFeature(authConfig)],
      inject: [authConfig.KEY],
      useFactory: (config: AuthConfig) => ({
        secret: config.jwtSecret,
        signOptions: { algorithm: 'HS256', expiresIn: config.jwtExpiresInS },
        verifyOptions: { algorithms: ['HS256'] },
      }),
    }),
    // The sign-in limits (ThrottlerModule is global, but only SignInThrottlerGuard on the login
    // route applies them; there is no global ThrottlerGuard).
    ThrottlerModule.forRootAsync({
      imports: [ConfigModule.forFeature(authConfig), RateLimitsModule],
      inject: [authConfig.KEY, PostgresThrottlerStorage],
      useFactory: signInThrottlerOptions,
    }),
  ],
  controllers: [AuthController],
  providers: [AuthService, SessionsService, JwtStrategy],
  // SessionsService: for the member changes that must end sessions (deactivation, password change)
  exports: [AuthService, SessionsService],
})
export class AuthModule {}
