import './ui/localeGuard';
import { render } from 'preact';
import 'uplot/dist/uPlot.min.css';
import './ui/styles.css';
import { App } from './ui/App';
import { registerServiceWorker, requestPersistence } from './ui/offline';
import { startRouter } from './ui/router';

startRouter();
render(<App />, document.getElementById('app')!);
registerServiceWorker();
void requestPersistence();
