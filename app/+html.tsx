import type { PropsWithChildren } from 'react';
import { ScrollViewStyleReset } from 'expo-router/html';
import { palette } from '@/constants/theme';

// The page colour is set before any script runs, so dark mode opens without a white flash.
const pageCss = `
html, body, #root { background-color: ${palette.light.background}; color: ${palette.light.text}; }
@media (prefers-color-scheme: dark) {
  html, body, #root { background-color: ${palette.dark.background}; color: ${palette.dark.text}; }
}
:root { color-scheme: light dark; }
`;

/** The web document around the app (web only; rendered at build time, never touches the DOM). */
export default function Root({ children }: PropsWithChildren) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        <meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover" />
        <meta name="description" content="Shoalshift forecasts what a stocking change will do to a tank's nitrogen cycle." />
        <meta name="theme-color" media="(prefers-color-scheme: light)" content={palette.light.background} />
        <meta name="theme-color" media="(prefers-color-scheme: dark)" content={palette.dark.background} />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: pageCss }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
