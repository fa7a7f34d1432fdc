import { Module } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ServeStaticModule } from '@nestjs/serve-static';
import { TypeOrmModule } from '@nestjs/typeorm';
import { appConfig, type AppConfig } from './config/app.config.js';
import { authConfig } from './config/auth.config.js';
import { ENV_FILE } from './config/checkout-paths.js';
import { databaseConfig, type DatabaseConfig } from './config/database.config.js';
import { weatherConfig } from './config/weather.config.js';
import { validateEnv } from './config/env.schema.js';
import { ApiExceptionFilter } from './common/filters/api-exception.filter.js';
import { JwtAuthGuard } from './common/guards/jwt-auth.guard.js';
import { RolesGuard } from './common/guards/roles.guard.js';
import { typeOrmOptions } from './database/typeorm-options.js';
import { AuthModule } from './auth/auth.module.js';
import { HealthModule } from './health/health.module.js';
import { OrganisationsModule } from './organisations/organisations.module.js';
import { UsersModule } from './users/users.module.js';
import { SitesModule } from './sites/sites.module.js';
import { LinksModule } from './links/links.module.js';
import { EvaluateModule } from './evaluate/evaluate.module.js';
import { EquipmentModule } from './equipment/equipment.module.js';
import { WeatherModule } from './weather/weather.module.js';
import { API_PATH_PATTERN, isUiBuilt } from './spa/ui-dist.js';

@Module({
  imports: [
    ConfigModule.forRoot({
      isGlobal: true,
      envFilePath: ENV_FILE,
      validate: validateEnv,
      load: [appConfig, authConfig, databaseConfig, weatherConfig],
    }),
    TypeOrmModule.forRootAsync({
      inject: [databaseConfig.KEY],
      useFactory: (database: DatabaseConfig) => ({
        ...typeOrmOptions(database),
        // each feature module registers its own entities through forFeature
        entities: [],
        autoLoadEntities: true,
        migrationsRun: false,
        retryAttempts: 5,
        retryDelay: 1000,
      }),
    }),
    // The built SPA from the same process, with history fallback; /api stays with Nest.
    ServeStaticModule.forRootAsync({
      inject: [appConfig.KEY],
      useFactory: (app: AppConfig) =>
        isUiBuilt(app.uiDistDir) ? [{ rootPath: app.uiDistDir, exclude: API_PATH_PATTERN as unknown as string[] }] : [],
    }),
    OrganisationsModule,
    UsersModule,
    AuthModule,
    HealthModule,
    SitesModule,
    EquipmentModule,
    LinksModule,
    EvaluateModule,
    WeatherModule,
  ],
  providers: [
    { provide: APP_GUARD, useClass: JwtAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
