import { Global, Module, type DynamicModule } from '@nestjs/common';
import type { AppConfig } from './app-config';
import { APP_CONFIG } from './config.tokens';

/** Provides the AppConfig parsed once at start to every module. */
@Global()
@Module({})
export class ConfigModule {
  static forRoot(config: AppConfig): DynamicModule {
    return { module: ConfigModule, providers: [{ provide: APP_CONFIG, useValue: config }], exports: [APP_CONFIG] };
  }
}
