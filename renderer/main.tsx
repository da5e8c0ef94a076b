import { createRoot } from 'react-dom/client';
import type { TagbenchBridge } from '../electron/common/ipc-contract';
import { App } from './app/App';
import { createBrowserHost } from './host/browser-host';
import { createElectronHost } from './host/electron-host';
import { AnalysisClient } from './worker/client';
import './styles.css';

const bridge = (window as unknown as { tagbench?: TagbenchBridge }).tagbench;
const host = bridge ? createElectronHost(bridge) : createBrowserHost();
document.documentElement.dataset.host = host.kind;

createRoot(document.getElementById('root')!).render(<App host={host} client={new AnalysisClient()} />);
