// Framing beside the loop breakdown drawer: the width of the sheet it leaves uncovered.
import { describe, expect, it } from 'vitest';
import { MIN_FREE_WIDTH, freeWidth } from '../../app/renderer/sheet/view.js';

const sheet = { left: 100, top: 40, width: 800, height: 460 };

describe('freeWidth', () => {
  it('is the whole sheet with no drawer', () => {
    expect(freeWidth(sheet, null)).toBe(800);
  });

  it('stops short of an open drawer on the right', () => {
    // Drawer 372 px wide, 10 px from the right edge: 800 - 382 - 8 px margin.
    expect(freeWidth(sheet, { left: 100 + 800 - 382, top: 50, width: 372, height: 440 })).toBe(410);
  });

  it('ignores a folded drawer (a short strip)', () => {
    expect(freeWidth(sheet, { left: 518, top: 450, width: 372, height: 40 })).toBe(800);
  });

  it('uses the whole sheet when the drawer leaves too little beside it', () => {
    const narrow = { left: 100, top: 40, width: 500, height: 460 };
    expect(freeWidth(narrow, { left: 100 + 90, top: 50, width: 400, height: 440 })).toBe(500);
    expect(MIN_FREE_WIDTH).toBeGreaterThan(82);
  });
});
