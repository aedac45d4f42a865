/** A piece of plain text: either words or a web link. */
export type TextSegment = { kind: 'text'; text: string } | { kind: 'link'; text: string; url: string };

// http(s) URLs up to whitespace or an angle bracket; trailing sentence punctuation is trimmed below.
const URL_PATTERN = /https?:\/\/[^\s<>"]+/g;
const TRAILING_PUNCTUATION = /[.,;:!?)\]'}]+$/;

/** Splits text into plain parts and http(s) links, so each link can be drawn as a link. */
export function splitLinks(text: string): TextSegment[] {
  const out: TextSegment[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    const url = match[0].replace(TRAILING_PUNCTUATION, '');
    if (start > last) out.push({ kind: 'text', text: text.slice(last, start) });
    out.push({ kind: 'link', text: url, url });
    last = start + url.length;
  }
  if (last < text.length) out.push({ kind: 'text', text: text.slice(last) });
  return out;
}
