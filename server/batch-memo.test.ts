import { describe, expect, it } from 'vitest';
import { batchMemo } from './batch-memo';

describe('a batch memo', () => {
  it('loads each key once, concurrent callers included', async () => {
    const memo = batchMemo();
    let loads = 0;
    const load = async () => ++loads;
    const [a, b] = await Promise.all([memo.once('x', load), memo.once('x', load)]);
    expect([a, b, await memo.once('x', load)]).toEqual([1, 1, 1]);
    expect(await memo.once('y', load)).toBe(2);
    expect(loads).toBe(2);
  });

  it('keeps no failed load: the next caller loads again', async () => {
    const memo = batchMemo();
    await expect(memo.once('x', () => Promise.reject(new Error('down')))).rejects.toThrow('down');
    expect(await memo.once('x', async () => 'up')).toBe('up');
  });

  it('is per batch: a new memo loads afresh', async () => {
    expect(await batchMemo().once('x', async () => 1)).toBe(1);
    expect(await batchMemo().once('x', async () => 2)).toBe(2);
  });
});
