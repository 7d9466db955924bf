/**
 * V8 makes a cut of 13 or more characters (slice, split, substring) a view into the string it was cut
 * from, so a kept cell (a group's key, a finding's value, a distinct value in a profile) would keep
 * the whole 64 KB of text it was read from alive. Such cuts go through here.
 */
const VIEW_MIN = 13;

/** The same text as a string of its own: a rope of a space and the text flattens into a new string. */
export function ownString(view: string): string {
  return view.length < VIEW_MIN ? view : (" " + view).slice(1);
}
