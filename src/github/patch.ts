/**
 * Which lines of the new version of a file a review comment may be placed on: the right-hand side of the hunks in
 * the file's unified diff (added lines and the context lines shown around them). GitHub accepts review comments
 * only on lines that appear in the diff; anything else is answered with 422.
 *
 * Hunk header format: `@@ -oldStart[,oldCount] +newStart[,newCount] @@` (GNU diffutils manual, "Detailed
 * Description of Unified Format"); a missing count means 1.
 */

export interface DiffLines {
  /** Lines of the new file that are shown in the diff (added or context). */
  commentable: Set<number>;
  /** Lines the pull request added or changed. */
  added: Set<number>;
}

export function parsePatch(patch: string): DiffLines {
  const commentable = new Set<number>();
  const added = new Set<number>();
  let newLine = 0;
  let oldLeft = 0;
  let newLeft = 0;
  for (const line of patch.split('\n')) {
    const header = /^@@ -\d+(?:,(\d+))? \+(\d+)(?:,(\d+))? @@/.exec(line);
    if (header !== null) {
      oldLeft = header[1] === undefined ? 1 : Number(header[1]);
      newLine = Number(header[2]);
      newLeft = header[3] === undefined ? 1 : Number(header[3]);
      continue;
    }
    if (oldLeft <= 0 && newLeft <= 0) continue; // outside a hunk (file headers, trailing text)
    if (line.startsWith('\\')) continue; // "\ No newline at end of file"
    if (line.startsWith('+')) {
      commentable.add(newLine);
      added.add(newLine);
      newLine++;
      newLeft--;
    } else if (line.startsWith('-')) {
      oldLeft--;
    } else {
      commentable.add(newLine);
      newLine++;
      newLeft--;
      oldLeft--;
    }
  }
  return { commentable, added };
}
