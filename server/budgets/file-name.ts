/**
 * A title as the stem of a download name (`gauge-block-50-mm`): letters, digits and dashes only, so
 * it is safe in a Content-Disposition header and on every file system; at most 80 characters, cut
 * without leaving a dash at the end; `budget` when nothing is left.
 */
export function fileStem(title: string): string {
  return (
    title
      .normalize('NFKD')
      .replace(/[^\w\s-]/g, '')
      .trim()
      .toLowerCase()
      .replace(/[\s_-]+/g, '-')
      .slice(0, 80)
      .replace(/-+$/, '') || 'budget'
  );
}
