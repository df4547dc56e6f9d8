import { describe, expect, test } from 'vitest';
import { canMove, movesFor } from '../../../src/lib/briefs/transitions';
import { BRIEF_STATE_LOOK } from '../../../src/components/ui/state-look';

describe('the end of a brief: delivered, then paid in full', () => {
  test('staff mark a design delivered; only the product, on the paid balance, ends it paid in full', () => {
    expect(canMove('in-design', 'delivered', 'staff')).toBe(true);
    expect(canMove('delivered', 'paid-in-full', 'system')).toBe(true);
    expect(canMove('delivered', 'paid-in-full', 'staff')).toBe(false);
    expect(canMove('delivered', 'paid-in-full', 'owner')).toBe(false);
    expect(canMove('in-design', 'paid-in-full', 'system')).toBe(false);
  });

  test('a brief paid in full moves nowhere, and reads as such on screen', () => {
    for (const actor of ['owner', 'staff', 'system'] as const) expect(movesFor('paid-in-full', actor)).toEqual([]);
    expect(BRIEF_STATE_LOOK['paid-in-full']).toMatchObject({ label: 'Paid in full', tone: 'ok' });
  });
});
