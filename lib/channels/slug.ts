import { randomBytes } from 'node:crypto';

export function slugifyChannelName(name: string): string {
  const base = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  return base || 'channel';
}

// A short random tail keeps slugs unique without asking the database first.
export function makeChannelSlug(name: string): string {
  const tail = randomBytes(3).toString('hex');
  return `${slugifyChannelName(name)}-${tail}`;
}
