/**
 * GitHub Flavored Markdown rendered to HTML by micromark with its GFM extension (dev dependency
 * `micromark` + `micromark-extension-gfm`: an implementation of the GFM spec — tables, task lists,
 * strikethrough, autolink literals, footnotes). Raw HTML is allowed through, as GitHub allows a sanitised subset,
 * so a test sees whether record text could have produced a tag.
 */
import { micromark } from 'micromark';
import { gfm, gfmHtml } from 'micromark-extension-gfm';

export function renderGfm(markdown: string): string {
  return micromark(markdown, {
    allowDangerousHtml: true,
    extensions: [gfm()],
    htmlExtensions: [gfmHtml()],
  });
}

/** Rendered HTML with the zero-width joiners taken out (they are invisible; GitHub shows the same text). */
export function renderedText(markdown: string): string {
  return renderGfm(markdown).replace(/\u200D/g, '');
}
