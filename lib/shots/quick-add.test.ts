import { describe, expect, it } from 'vitest';
import { parseShotLines } from './quick-add';

describe('parseShotLines', () => {
  it('makes one shot per non-empty line with the default framing and camera', () => {
    expect(parseShotLines('Rip the legs\n\n  Glue up the seat  \n')).toEqual({
      shots: [
        { framing: 'medium', camera: 'a_cam', description: 'Rip the legs' },
        { framing: 'medium', camera: 'a_cam', description: 'Glue up the seat' },
      ],
      errors: [],
    });
  });

  it('reads framing and camera from a head before a colon', () => {
    const { shots } = parseShotLines(['CU: glue squeeze-out', 'Overhead / Top cam: layout lines', 'B cam, extreme close-up: tenon shoulder', 'POV on Phone: chisel paring'].join('\n'));
    expect(shots).toEqual([
      { framing: 'close_up', camera: 'a_cam', description: 'glue squeeze-out' },
      { framing: 'overhead', camera: 'top_cam', description: 'layout lines' },
      { framing: 'extreme_close_up', camera: 'b_cam', description: 'tenon shoulder' },
      { framing: 'pov', camera: 'phone', description: 'chisel paring' },
    ]);
  });

  it('takes a bare capital abbreviation but not an ordinary leading word', () => {
    const { shots } = parseShotLines('WS the whole bench\nInsert the dowels into the holes\nWide shot: the shop');
    expect(shots.map((s) => [s.framing, s.description])).toEqual([
      ['wide', 'the whole bench'],
      ['medium', 'Insert the dowels into the holes'],
      ['wide', 'the shop'],
    ]);
  });

  it('keeps a colon that is part of the description', () => {
    expect(parseShotLines('Note to self: check the fence').shots[0]).toEqual({ framing: 'medium', camera: 'a_cam', description: 'Note to self: check the fence' });
  });

  it('drops bullets and list numbers', () => {
    expect(parseShotLines('- CU: one\n2. two\n• three').shots.map((s) => s.description)).toEqual(['one', 'two', 'three']);
  });

  it('reports a head without a description and an over-long line, by line number', () => {
    const { shots, errors } = parseShotLines(`CU:\nfine\n${'x'.repeat(301)}`);
    expect(shots).toHaveLength(1);
    expect(errors.map((e) => e.line)).toEqual([1, 3]);
  });
});
