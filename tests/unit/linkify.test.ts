import { describe, expect, it } from 'vitest';
import { splitLinks } from '@/lib/linkify';

describe('splitLinks', () => {
  it('returns plain text untouched as one segment', () => {
    expect(splitLinks('No links here.')).toEqual([{ kind: 'text', text: 'No links here.' }]);
  });

  it('returns nothing for empty text', () => {
    expect(splitLinks('')).toEqual([]);
  });

  it('finds a link between words and keeps the words around it', () => {
    expect(splitLinks('Open http://127.0.0.1:8081/reset-password?token=abc to continue')).toEqual([
      { kind: 'text', text: 'Open ' },
      { kind: 'link', text: 'http://127.0.0.1:8081/reset-password?token=abc', url: 'http://127.0.0.1:8081/reset-password?token=abc' },
      { kind: 'text', text: ' to continue' },
    ]);
  });

  it('leaves sentence punctuation after a link outside the link', () => {
    expect(splitLinks('See https://example.org/a.')).toEqual([
      { kind: 'text', text: 'See ' },
      { kind: 'link', text: 'https://example.org/a', url: 'https://example.org/a' },
      { kind: 'text', text: '.' },
    ]);
  });

  it('finds several links and ignores non-web schemes', () => {
    const parts = splitLinks('a https://x.org b mailto:k@x.org c http://y.org');
    expect(parts.filter((p) => p.kind === 'link').map((p) => p.text)).toEqual(['https://x.org', 'http://y.org']);
    expect(parts.map((p) => p.text).join('')).toBe('a https://x.org b mailto:k@x.org c http://y.org');
  });
});
