import { describe, expect, it } from 'vitest';
import { can, capabilities, roles, type Capability, type Role } from './policy';

// The table of ../shared/DESIGN.md, "People and what they may do", row by row. H = Host, S = Shop hand, E = Editor.
const expected: Record<Capability, string> = {
  'crew.manage': 'H', // invite crew, change roles
  'channel.settings': 'H',
  'episodes.edit': 'H', // create / edit / reorder episodes and segments
  'scripts.write': 'H',
  'scripts.read': 'HSE', // read scripts, running order, runtime forecast
  'shots.edit': 'H', // create, edit and assign shots
  'shots.editAssigned': 'HS', // shop hand: edit own assigned
  'shots.changeState': 'HS',
  'safety.review': 'H', // issue 4: a Host ticks "Safety reviewed"
  'cutlist.edit': 'HS', // parts list, stock rack, cut plans
  'cutlist.read': 'HSE',
  'clips.upload': 'HS',
  'clips.read': 'HSE', // download / preview clips
  'clips.delete': 'H',
  'clips.deleteOwn': 'HS',
  'sponsors.manage': 'H',
  'sponsors.readDisclosure': 'HE', // editor reads disclosure and talking points
  'handoff.lock': 'H',
  'handoff.read': 'HE', // issue 14: the handoff holds sponsor talking points (sponsors.readDisclosure is HE)
  'editNotes.edit': 'HE', // edit stage, edit notes
  'crew.read': 'HSE',
};

const letter: Record<Role, string> = { host: 'H', shop_hand: 'S', editor: 'E' };

describe('role matrix', () => {
  it('covers every capability', () => {
    expect(Object.keys(expected).sort()).toEqual([...capabilities].sort());
  });

  for (const capability of capabilities) {
    for (const role of roles) {
      const allowed = expected[capability].includes(letter[role]);
      it(`${role} ${allowed ? 'may' : 'may not'} ${capability}`, () => {
        expect(can(role, capability)).toBe(allowed);
      });
    }
  }
});
