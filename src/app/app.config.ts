import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { ApplicationConfig, inject, isDevMode, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { MAT_ICON_DEFAULT_OPTIONS } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding, withInMemoryScrolling, withNavigationErrorHandler } from '@angular/router';
import { provideServiceWorker } from '@angular/service-worker';
import { APP_NAVIGATION } from './app.navigation';
import { routes } from './app.routes';
import { csrfInterceptor } from './core/auth/csrf-interceptor';
import { signInRedirectInterceptor } from './core/auth/sign-in-redirect-interceptor';
import { NAVIGATION_ENTRIES } from './core/navigation/navigation-entry';
import { AppUpdates } from './core/updates/app-updates';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(
      routes,
      withComponentInputBinding(),
      withInMemoryScrolling({ scrollPositionRestoration: 'top' }),
      withNavigationErrorHandler((error) => inject(AppUpdates).failedNavigation(error)),
    ),
    provideHttpClient(withInterceptors([csrfInterceptor, signInRedirectInterceptor])),
    provideServiceWorker('ngsw-worker.js', {
      enabled: !isDevMode(),
      registrationStrategy: 'registerWhenStable:30000',
    }),
    { provide: NAVIGATION_ENTRIES, useValue: APP_NAVIGATION },
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-symbols-outlined' } },
  ],
};
