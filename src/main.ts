import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { prefetchFirstScreen } from './app/first-screen-pages';

prefetchFirstScreen(location.pathname + location.search);
// The bundle's evaluation and the app's first render are two tasks, not one: a phone's main
// thread is free in between (for input, and to send the requests started above), and neither
// task is as long as both together.
setTimeout(() => bootstrapApplication(App, appConfig).catch((error: unknown) => console.error(error)));
