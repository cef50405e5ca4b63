// Copy the checked chart SVG for pasting into a vector editor: as an SVG image where the clipboard takes
// one (the Async Clipboard API's image/svg+xml), and always as text, which vector editors also accept.
export async function copySvgToClipboard(svg: string): Promise<'svg' | 'text'> {
  const clipboard = typeof navigator === 'undefined' ? undefined : navigator.clipboard;
  if (!clipboard) throw new Error('This window has no clipboard access.');
  if (typeof ClipboardItem !== 'undefined' && typeof ClipboardItem.supports === 'function' && ClipboardItem.supports('image/svg+xml')) {
    try {
      await clipboard.write([new ClipboardItem({ 'image/svg+xml': new Blob([svg], { type: 'image/svg+xml' }), 'text/plain': new Blob([svg], { type: 'text/plain' }) })]);
      return 'svg';
    } catch {
      // Fall back to text below.
    }
  }
  await clipboard.writeText(svg);
  return 'text';
}
