import { createSecretKey } from 'node:crypto';
import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { APP_GUARD } from '@nestjs/core';
import { JwtModule } from '@nestjs/jwt';
import { RolesGuard } from '../core/guards/roles.guard';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JwtAuthGuard } from './jwt-auth.guard';
import { LoginThrottleRepository } from './login-throttle.repository';
import { LoginThrottleService } from './login-throttle.service';
import { DEFAULTS } from '../config/app-config';

@Module({
  imports: [
    UsersModule,
    JwtModule.registerAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => ({
        // a ready key object: given a string, the verifier first tries (and fails) to read it as a public key
        // on every request, which cost about 0.7 ms of CPU per call
        secret: createSecretKey(Buffer.from(config.getOrThrow<string>('JWT_SECRET'))),
        signOptions: { expiresIn: config.get('JWT_EXPIRES_IN') ?? DEFAULTS.JWT_EXPIRES_IN, algorithm: 'HS256' },
        verifyOptions: { algorithms: ['HS256'] },
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [
    AuthService,
    LoginThrottleRepository,
    LoginThrottleService,
    { provide: APP_GUARD, useClass: JwtAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
  ],
  exports: [AuthService],
})
export class AuthModule {}
