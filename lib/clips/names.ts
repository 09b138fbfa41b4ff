import { withoutInvisible } from '@/lib/text/visible-name';

/**
 * The name a person sees for an uploaded file. It is never used as a path (bytes are stored under
 * the server's upload id), but it is still reduced to its last segment so "../../x" reads as "x".
 */
export function displayName(raw: string): string {
  const last = raw.split(/[/\\]/).filter((p) => p !== '' && p !== '.' && p !== '..').pop() ?? '';
  // Control, zero-width and text-direction characters go (lib/text/visible-name.ts says why).
  const clean = withoutInvisible(last).trim().slice(0, 255);
  return clean || 'clip';
}

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  const units = ['KiB', 'MiB', 'GiB', 'TiB'];
  let v = n / 1024;
  let i = 0;
  while (v >= 1024 && i < units.length - 1) {
    v /= 1024;
    i++;
  }
  return `${v.toFixed(v < 10 ? 1 : 0)} ${units[i]}`;
}
