// LIKE patterns from what people type: % _ and \ match themselves, never act as wildcards.
const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => '\\' + c)

export const containsPattern = (text: string) => `%${escapeLike(text)}%`
export const prefixPattern = (text: string) => `${escapeLike(text)}%`
