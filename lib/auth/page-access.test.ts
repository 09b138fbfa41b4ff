import { describe, expect, it } from 'vitest';
import { pageCapability } from './page-access';
import { rolesWith } from './policy';

describe('pageCapability', () => {
  it('finds what each refusing page asks for from its address', () => {
    expect(pageCapability('/c/shop/episodes/new')).toBe('episodes.edit');
    expect(pageCapability('/c/shop/episodes/e1/edit')).toBe('episodes.edit');
    expect(pageCapability('/c/shop/episodes/e1/handoff/2')).toBe('handoff.read');
    expect(pageCapability('/c/shop/sponsors')).toBe('sponsors.readDisclosure');
    expect(pageCapability('/c/shop/sponsors/d1/')).toBe('sponsors.manage');
    expect(pageCapability('/c/shop/settings/crew')).toBe('crew.manage');
  });
  it('is null for pages every crew member may open, and outside a channel', () => {
    expect(pageCapability('/c/shop')).toBeNull();
    expect(pageCapability('/c/shop/episodes/e1')).toBeNull();
    expect(pageCapability('/welcome')).toBeNull();
  });
});

describe('rolesWith', () => {
  it('lists the roles of a capability in the matrix order', () => {
    expect(rolesWith('crew.manage')).toEqual(['host']);
    expect(rolesWith('handoff.read')).toEqual(['host', 'editor']);
  });
});
