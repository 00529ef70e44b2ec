/** Hands the browser a file made on the page, as a download named `fileName`. */
export function saveFile(content: Blob | string, fileName: string, type = 'text/csv;charset=utf-8'): void {
  const blob = typeof content === 'string' ? new Blob([content], { type }) : content;
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // The click has handed the file over; the address is kept a moment for browsers that read it late.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
