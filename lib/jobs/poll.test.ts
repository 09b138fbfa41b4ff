import { afterEach, describe, expect, it, vi } from 'vitest';
import { pollEvery } from './poll';

afterEach(() => vi.useRealTimers());

describe('pollEvery', () => {
  it('never runs the task twice at once, and keeps going after a failure', async () => {
    vi.useFakeTimers();
    let running = 0;
    let most = 0;
    let calls = 0;
    let finish: () => void = () => {};
    const error = vi.spyOn(console, 'error').mockImplementation(() => {});
    const timer = pollEvery(100, 'test task', () => {
      calls++;
      running++;
      most = Math.max(most, running);
      if (calls === 1) return Promise.reject(new Error('first fails')).finally(() => running--);
      return new Promise<void>((r) => (finish = () => (running--, r())));
    });
    await vi.advanceTimersByTimeAsync(100);
    expect(error).toHaveBeenCalledWith('test task', expect.any(Error));
    await vi.advanceTimersByTimeAsync(500);
    expect(calls).toBe(2);
    finish();
    await vi.advanceTimersByTimeAsync(100);
    expect(calls).toBe(3);
    expect(most).toBe(1);
    clearInterval(timer);
    error.mockRestore();
  });
});
