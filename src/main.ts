import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { prefetchFirstScreen } from './app/first-screen-pages';

// The bundle's evaluation, the first page's code (evaluated when it arrives) and the app's
// bootstrap and first render are separate tasks, not one: a phone's main thread is free in
// between (for input, and to send the requests started here), and none is as long as all
// together. The first page's code comes with index.html's preloads, beside this bundle.
void prefetchFirstScreen(location.pathname + location.search).then(() =>
  setTimeout(() => bootstrapApplication(App, appConfig).catch((error: unknown) => console.error(error))),
);
