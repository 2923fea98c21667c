import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { DynamicModule, Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { APP_FILTER, APP_PIPE } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { ServeStaticModule } from '@nestjs/serve-static';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuthModule } from './auth/auth.module';
import { AppConfigModule, environment, readAppConfig } from './config/app-config';
import { validateEnv } from './config/env.validation';
import { ApiExceptionFilter } from './core/filters/api-exception.filter';
import { createValidationPipe } from './core/validation.pipe';
import { typeormOptions } from './database/typeorm-options';
import { HealthModule } from './health/health.module';
import { UsersModule } from './users/users.module';
import { AuditModule } from './audit/audit.module';
import { FleetModule } from './fleet/fleet.module';
import { MovesModule } from './moves/moves.module';
import { PermitsModule } from './permits/permits.module';
import { RulebookModule } from './rulebook/rulebook.module';
import { RunSheetsModule } from './run-sheets/run-sheets.module';
import { MailModule } from './mail/mail.module';
import { VendorsModule } from './vendors/vendors.module';
import { EscortsModule } from './escorts/escorts.module';

function frontendModules(): DynamicModule[] {
  const dist = readAppConfig().frontendDist;
  if (!existsSync(join(dist, 'index.html'))) return [];
  return [ServeStaticModule.forRoot({ rootPath: dist, exclude: ['/api/{*path}'] })];
}

@Module({
  imports: [
    AppConfigModule,
    // the checked settings for the modules that read them by name (from the environment app-config reads)
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, validate: () => validateEnv(environment()) }),
    TypeOrmModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => ({
        ...typeormOptions(config.getOrThrow<string>('DATABASE_URL')),
        autoLoadEntities: true,
        migrationsRun: true,
      }),
    }),
    ScheduleModule.forRoot(),
    ...frontendModules(),
    HealthModule,
    UsersModule,
    AuthModule,
    AuditModule,
    FleetModule,
    RulebookModule,
    MovesModule,
    PermitsModule,
    RunSheetsModule,
    MailModule,
    VendorsModule,
    EscortsModule,
  ],
  providers: [
    { provide: APP_PIPE, useFactory: createValidationPipe },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
