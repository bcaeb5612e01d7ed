// Start-up: mount the app, open the demo job (browser) or wait for the main process (desktop),
// start autosave and offer what an earlier session left unsaved.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@xyflow/react/dist/style.css';
import './styles.css';
import demoText from '../../assets/demo.lwj?raw';
import { App } from './app/App.js';
import { connectDesktop } from './app/desktop.js';
import { useUi } from './app/ui.js';
import { openText } from './io/files.js';
import { startAutosave, takeRecovery, takeSaved } from './io/autosave.js';
import { startPresence } from './io/session.js';
import { useEditor } from './store/editor.js';

const api = window.loopwright;
if (api) connectDesktop(api);
else {
  // The job last saved in this tab (else in this browser) reopens after a reload; the demo otherwise.
  const saved = takeSaved();
  if (saved) {
    useEditor.getState().loadJob(saved.job, { name: saved.fileName ?? 'job.lwj' });
    useEditor.getState().setMessage({ kind: 'info', text: `Reopened ${saved.fileName ?? 'the last saved job'}, as last saved` });
  } else {
    openText(demoText, 'demo.lwj');
    // The demo opens untitled, so Save asks for a new name and never writes over the shipped file.
    useEditor.setState({ fileName: null, filePath: null, message: { kind: 'info', text: 'Opened the demo job' } });
  }
  startPresence();
  const recovery = takeRecovery();
  if (recovery) useUi.getState().set({ recovery });
  startAutosave();
}

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
