import { escapeHtml } from './escape-html';

/**
 * Content-Security-Policy for the fakes' pages: no scripts, no external resources, inline styles only.
 * Frames are left unrestricted so that the mailbox can show a message's HTML in a sandboxed srcdoc frame,
 * which inherits this policy.
 */
export const pageSecurityPolicy = [
  "script-src 'none'",
  "object-src 'none'",
  "connect-src 'none'",
  "font-src 'none'",
  "media-src 'none'",
  "img-src 'self' data:",
  "style-src 'unsafe-inline'",
  "base-uri 'none'",
  "frame-ancestors 'none'",
].join('; ');

const styles = `
  :root { color-scheme: light; --ink: #1f2328; --muted: #59636e; --line: #d1d9e0; --accent: #1f6feb; --panel: #f6f8fa; }
  * { box-sizing: border-box; }
  body { margin: 0; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; color: var(--ink); background: #fff; }
  main { max-width: 46rem; margin: 2.5rem auto; padding: 0 1.25rem; }
  h1 { font-size: 1.5rem; margin: 0 0 .25rem; }
  h2 { font-size: 1.1rem; margin: 1.75rem 0 .5rem; }
  p { margin: .5rem 0; }
  .notice { background: #fff8c5; border: 1px solid #d4a72c66; border-radius: 6px; padding: .6rem .9rem; }
  .muted { color: var(--muted); }
  code { font: .9em ui-monospace, SFMono-Regular, Menlo, monospace; background: var(--panel); padding: .1em .3em; border-radius: 4px; }
  button, .button { font: inherit; cursor: pointer; border: 1px solid var(--line); border-radius: 6px; background: var(--panel);
    color: var(--ink); padding: .45rem .9rem; text-decoration: none; display: inline-block; }
  button:hover, .button:hover { border-color: var(--accent); }
  button.primary { background: #1f883d; border-color: #1a7f37; color: #fff; }
  input[type=text] { font: inherit; padding: .4rem .6rem; border: 1px solid var(--line); border-radius: 6px; min-width: 16rem; }
  label { font-weight: 600; display: block; margin-bottom: .25rem; }
  table { border-collapse: collapse; width: 100%; }
  th, td { text-align: left; padding: .45rem .5rem; border-bottom: 1px solid var(--line); vertical-align: top; }
  th { font-size: .85rem; color: var(--muted); font-weight: 600; }
  a { color: var(--accent); }
  pre { white-space: pre-wrap; word-break: break-word; background: var(--panel); border: 1px solid var(--line);
    border-radius: 6px; padding: .9rem; font: .9rem/1.5 ui-monospace, SFMono-Regular, Menlo, monospace; }
  iframe { width: 100%; min-height: 24rem; border: 1px solid var(--line); border-radius: 6px; background: #fff; }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; margin: 1rem 0; }
  dt { color: var(--muted); }
  dd { margin: 0; word-break: break-word; }
`;

/** A complete, self-contained HTML document. `body` must already be escaped HTML. */
export function htmlPage(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${styles}</style>
</head>
<body>
<main>
${body}
</main>
</body>
</html>
`;
}
