import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { palette } from '@/constants/theme';

// With web output "single", Expo builds dist/index.html from public/index.html (app/+html.tsx is
// used only for static output), so its hard-coded page colours must match the theme tokens.
const html = readFileSync(fileURLToPath(new URL('../../public/index.html', import.meta.url)), 'utf8');

describe('public/index.html', () => {
  it.each(['light', 'dark'] as const)('paints the %s page and theme colour from the tokens', (scheme) => {
    const { background, text } = palette[scheme];
    expect(html).toContain(`media="(prefers-color-scheme: ${scheme})" content="${background}"`);
    expect(html).toContain(`background-color: ${background}; color: ${text};`);
  });

  it('keeps the placeholders Expo fills in and the root element', () => {
    expect(html).toContain('%LANG_ISO_CODE%');
    expect(html).toContain('%WEB_TITLE%');
    expect(html).toContain('<div id="root"></div>');
  });
});
