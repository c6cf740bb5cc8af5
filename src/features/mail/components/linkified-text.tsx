import { Fragment } from 'react';

// http(s) URLs up to whitespace; trailing punctuation that ends a sentence is not part of the link.
const URL_PATTERN = /https?:\/\/[^\s<>"]+/g;
const TRAILING = /[.,;:!?)\]]+$/;

/** Plain text with its web links made clickable; everything else stays text (no HTML is interpreted). */
export function LinkifiedText({ text }: { text: string }) {
  const parts: React.ReactNode[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    let url = match[0];
    const trail = url.match(TRAILING)?.[0] ?? '';
    url = url.slice(0, url.length - trail.length);
    parts.push(text.slice(last, start));
    parts.push(
      <a key={start} href={url} className="break-all text-signal-dark underline underline-offset-2 hover:text-ink" rel="noreferrer">
        {url}
      </a>,
    );
    last = start + url.length;
  }
  parts.push(text.slice(last));
  return (
    <>
      {parts.map((part, i) => (
        <Fragment key={i}>{part}</Fragment>
      ))}
    </>
  );
}
