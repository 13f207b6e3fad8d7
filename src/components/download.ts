/** Saves text as a file through the browser's download (a temporary object URL, revoked after the click). */
export function download(name: string, type: string, text: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

/** A file name safe on every desktop system: letters, digits, dot, dash and underscore; anything else becomes a dash. */
export const safeFileName = (base: string): string => base.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 120) || 'tenorscope';
