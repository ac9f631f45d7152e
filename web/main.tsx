import './lib/zod-without-eval';
import '@fontsource/ibm-plex-sans/400.css';
import '@fontsource/ibm-plex-sans/500.css';
import '@fontsource/ibm-plex-sans/600.css';
import '@fontsource/ibm-plex-mono/400.css';
import './styles/app.css';
import { createRoot } from 'react-dom/client';
import { App } from './app/app';
import { registerServiceWorker } from './service-worker/register';

const root = document.getElementById('root');
if (!root) throw new Error('index.html lacks the #root element');
createRoot(root).render(<App />);
registerServiceWorker();
