import { render } from 'preact';
import 'uplot/dist/uPlot.min.css';
import './ui/styles.css';
import { App } from './ui/App';
import { afterLoad } from './ui/idle';
import { afterStartUp } from './ui/startUp';
import { registerServiceWorker, requestPersistence } from './ui/offline';
import { startRouter } from './ui/router';

startRouter();
render(<App />, document.getElementById('app')!);
// None of this is needed for the first screen: it waits until the page has loaded and the browser is idle,
// each in its own task. The offline copy of the app (some 46 files) is fetched and stored by the service worker on
// the first visit: on a phone's few cores that competes with the first screen, so it waits until that has settled.
afterStartUp(registerServiceWorker);
afterLoad(() => void requestPersistence());
