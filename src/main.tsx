import { render } from 'preact';
import 'uplot/dist/uPlot.min.css';
import './ui/styles.css';
import { App } from './ui/App';
import { afterLoad } from './ui/idle';
import { registerServiceWorker, requestPersistence } from './ui/offline';
import { startRouter } from './ui/router';
import { prepareDateFormat } from './ui/visits/files';

startRouter();
render(<App />, document.getElementById('app')!);
// None of this is needed for the first screen: it waits until the page has loaded and the browser is idle,
// each in its own task. The date formatter is built ahead (the first one costs tens of ms for locale data),
// so the screen that first shows a date does not pay for it inside its render.
afterLoad(prepareDateFormat, 1500);
afterLoad(registerServiceWorker);
afterLoad(() => void requestPersistence());
