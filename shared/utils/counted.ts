/** A count in words: `counted(1, 'warning', 'warnings')` → "1 warning", `counted(2, …)` → "2 warnings". */
export const counted = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`
