import { createHash } from 'node:crypto';
import { escapeHtml } from '../escape-html';

/** Up to two capital letters: the first letters of the first two words of the name (or login). */
export function initialsOf(nameOrLogin: string): string {
  const words = nameOrLogin.split(/[\s\-_.]+/).filter((word) => word.length > 0);
  const letters = words.slice(0, 2).map((word) => word[0]!.toUpperCase());
  return letters.join('') || '?';
}

/** A colour that stays the same for a login, dark enough for white initials. */
export function avatarColour(login: string): string {
  const digest = createHash('sha256').update(login.toLowerCase()).digest();
  const hue = digest.readUInt16BE(0) % 360;
  return `hsl(${hue} 45% 38%)`;
}

export function avatarSvg(login: string, displayName: string): string {
  const initials = escapeHtml(initialsOf(displayName));
  return `<svg xmlns="http://www.w3.org/2000/svg" width="120" height="120" viewBox="0 0 120 120" role="img" aria-label="${escapeHtml(displayName)}">
<rect width="120" height="120" rx="16" fill="${avatarColour(login)}"/>
<text x="60" y="60" dy=".35em" text-anchor="middle" font-family="system-ui, sans-serif" font-size="48" font-weight="600" fill="#fff">${initials}</text>
</svg>
`;
}
