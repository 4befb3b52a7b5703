import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource-variable/nunito/wght.css';
import './styles/app.css';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';

// The CSP forbids eval, so zod's compiled parsers can never run; jitless also stops zod probing
// with `new Function`, which the browser reports as a CSP violation on every page. Set through
// the global zod reads its settings from (zod/v4/core/core.js), because importing zod's `config`
// here would put part of zod on the landing page; zod is loaded later, with the forms.
const zodGlobal = globalThis as { __zod_globalConfig?: Record<string, unknown> };
(zodGlobal.__zod_globalConfig ??= {}).jitless = true;

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

createRoot(root).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
