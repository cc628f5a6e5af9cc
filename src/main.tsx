import { StrictMode, startTransition } from 'react';
import { createRoot } from 'react-dom/client';
// DM Sans from the package (no font CDN): regular, medium and bold only, to keep the download small.
import '@fontsource/dm-sans/400.css';
import '@fontsource/dm-sans/500.css';
import '@fontsource/dm-sans/700.css';
import './index.css';
import { AppProvider } from './app/provider';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

// The first render is a transition, so React renders it in slices and yields to the browser between them
// instead of blocking the main thread for one long task (Lighthouse's total blocking time on the review room).
startTransition(() => {
  createRoot(root).render(
    <StrictMode>
      <AppProvider />
    </StrictMode>,
  );
});
