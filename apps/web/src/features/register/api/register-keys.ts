/** The root of every register query key, so one invalidation can refresh the whole register. */
export const registerKey = ['register'] as const;
