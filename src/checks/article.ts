/** A type or column word with "a" or "an" before it ("an integer", "a date"); the words are plain English. */
export function withArticle(word: string): string {
  return `${/^[aeiou]/i.test(word) ? "an" : "a"} ${word}`;
}
