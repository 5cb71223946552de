import { describe, expect, it } from 'vitest';
import { leastConnectedSlot } from '../../../server/boot/connection-balancer';

// The rule is ours (common practice for long-lived connections: "least connections" balancing).
describe('leastConnectedSlot', () => {
  it('when one worker holds fewer connections, then the next one goes there', () => {
    expect(leastConnectedSlot([5, 3, 4], 0)).toBe(1);
  });

  it('when the workers hold as many, then they take turns after the last one picked', () => {
    expect(leastConnectedSlot([2, 2, 2], 0)).toBe(1);
    expect(leastConnectedSlot([2, 2, 2], 1)).toBe(2);
    expect(leastConnectedSlot([2, 2, 2], 2)).toBe(0);
  });

  it('when a slot is being replaced, then it is passed over, and with none serving there is no slot', () => {
    expect(leastConnectedSlot([undefined, 9], 1)).toBe(1);
    expect(leastConnectedSlot([undefined, undefined], 0)).toBeUndefined();
  });

  it('when 40 connections are handed out one by one to two empty workers, then each gets 20', () => {
    const open = [0, 0];
    let last = -1;
    for (let i = 0; i < 40; i++) {
      last = leastConnectedSlot(open, last)!;
      open[last]! += 1;
    }
    expect(open).toEqual([20, 20]);
  });
});
