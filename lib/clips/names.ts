/**
 * The name a person sees for an uploaded file. It is never used as a path (bytes are stored under
 * the server's upload id), but it is still reduced to its last segment so "../../x" reads as "x".
 */
export function displayName(raw: string): string {
  const last = raw.split(/[/\\]/).filter((p) => p !== '' && p !== '.' && p !== '..').pop() ?? '';
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is removed
  const clean = last.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, 255);
  return clean || 'clip';
}

export const ACCEPTED_TYPE = /^(video|audio|image)\/[a-z0-9][a-z0-9.+-]{0,100}$/i;

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
