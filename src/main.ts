import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { prefetchFirstScreen } from './app/first-screen-pages';

prefetchFirstScreen(location.pathname + location.search);
bootstrapApplication(App, appConfig).catch((error: unknown) => console.error(error));
