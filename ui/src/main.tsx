import { createStyleRenderer } from '@/lib/content-security';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/open-sans/400.css';
import '@fontsource/open-sans/600.css';
import '@fontsource/open-sans/700.css';
import './index.css';
import { RendererProvider } from '@fluentui/react-components';
import { AppProvider } from '@/app/provider';
import { AppRouter } from '@/app/router';

const container = document.getElementById('root');
if (!container) throw new Error('The page has no #root element');

createRoot(container).render(
  <StrictMode>
    <RendererProvider renderer={createStyleRenderer()}>
      <AppProvider>
        <AppRouter />
      </AppProvider>
    </RendererProvider>
  </StrictMode>,
);
