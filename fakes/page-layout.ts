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

/**
 * Keyloom's own plain look (its teal seed colour and the system font), so that no stand-in can be taken for
 * the service it replaces; a band across the top says what the page is.
 */
const styles = `
  :root { color-scheme: light; --ink: #191c1d; --muted: #5b6163; --line: #c3cacb; --accent: #146871;
    --accent-dark: #004f56; --panel: #eef5f6; --note: #b8612d; }
  * { box-sizing: border-box; }
  body { margin: 0; font: 15px/1.5 system-ui, sans-serif; color: var(--ink); background: #fbfdfd; }
  .stand-in { background: var(--accent-dark); color: #fff; padding: .5rem 1.25rem; font-size: .9rem;
    border-bottom: 4px dashed var(--note); }
  .stand-in strong { letter-spacing: .02em; }
  main { max-width: 46rem; margin: 2rem auto; padding: 0 1.25rem; }
  h1 { font-size: 1.4rem; font-weight: 500; margin: 0 0 .25rem; }
  h2 { font-size: 1.05rem; font-weight: 500; margin: 1.75rem 0 .5rem; }
  p { margin: .5rem 0; }
  .notice { border-left: 4px solid var(--note); background: #fdf3ec; padding: .5rem .9rem; }
  .muted { color: var(--muted); }
  code { font: .9em ui-monospace, monospace; background: var(--panel); padding: .1em .3em; }
  button, .button { font: inherit; cursor: pointer; border: 1px solid var(--accent); border-radius: 4px;
    background: #fff; color: var(--accent); padding: .4rem .9rem; text-decoration: none; display: inline-block; }
  button:hover, .button:hover { background: var(--panel); }
  button.primary { background: var(--accent); color: #fff; }
  button.primary:hover { background: var(--accent-dark); }
  input[type=text] { font: inherit; padding: .4rem .6rem; border: 1px solid var(--line); border-radius: 4px;
    min-width: 16rem; }
  label { display: block; margin-bottom: .25rem; }
  table { border-collapse: collapse; width: 100%; }
  th, td { text-align: left; padding: .45rem .5rem; border-bottom: 1px solid var(--line); vertical-align: middle; }
  th { font-size: .85rem; color: var(--muted); font-weight: 500; }
  a { color: var(--accent); }
  pre { white-space: pre-wrap; word-break: break-word; background: var(--panel); border: 1px solid var(--line);
    padding: .9rem; font: .9rem/1.5 ui-monospace, monospace; }
  iframe { width: 100%; min-height: 24rem; border: 1px solid var(--line); background: #fff; }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; margin: 1rem 0; }
  dt { color: var(--muted); }
  dd { margin: 0; word-break: break-word; }
`;

/**
 * A complete, self-contained HTML document under a band naming the stand-in (`standIn`, such as "GitHub
 * sign-in"). `body` must already be escaped HTML.
 */
export function htmlPage(title: string, standIn: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${styles}</style>
</head>
<body>
<header class="stand-in"><strong>Keyloom</strong> · local stand-in for ${escapeHtml(standIn)}, for development
only</header>
<main>
${body}
</main>
</body>
</html>
`;
}
