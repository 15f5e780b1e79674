// Counts in sentences, the same on every screen and in every API message.

/** "1 design", "3 designs"; `many` for irregular plurals. */
export const counted = (n: number, one: string, many = `${one}s`): string => `${n} ${n === 1 ? one : many}`;

/** "once", "twice", "3 times". */
export const timesInWords = (n: number): string => (n === 1 ? 'once' : n === 2 ? 'twice' : `${n} times`);
