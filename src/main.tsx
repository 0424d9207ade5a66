import { render } from 'preact';
import 'uplot/dist/uPlot.min.css';
import './ui/styles.css';
import { App } from './ui/App';
import { afterLoad } from './ui/idle';
import { registerServiceWorker, requestPersistence } from './ui/offline';
import { startRouter } from './ui/router';

startRouter();
render(<App />, document.getElementById('app')!);
// None of this is needed for the first screen: it waits until the page has loaded and the browser is idle,
// each in its own task.
afterLoad(registerServiceWorker);
afterLoad(() => void requestPersistence());
