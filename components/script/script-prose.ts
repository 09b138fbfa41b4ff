// Readable prose for a script, shared by the editor and the read-only view so both look the same.
// Tailwind's preflight strips list markers and heading sizes, and the app has no typography plugin,
// so every element the script extensions render is styled here. An <ol type="a"> (only pasted HTML
// makes one) shows as decimal in both: telling "a" from "A" needs the selector flag `s`, and
// CSS.supports('selector(ol[type="a" s])') is false in Chromium 156 (checked).
export const scriptProseClasses = [
  'whitespace-pre-wrap break-words text-base leading-relaxed text-ink',
  '[&>*:first-child]:mt-0 [&>*:last-child]:mb-0',
  '[&_p]:my-3',
  '[&_h2]:mb-2 [&_h2]:mt-7 [&_h2]:text-xl [&_h2]:font-bold [&_h2]:leading-snug',
  '[&_h3]:mb-2 [&_h3]:mt-6 [&_h3]:text-lg [&_h3]:font-bold [&_h3]:leading-snug',
  '[&_ul]:my-3 [&_ul]:list-disc [&_ul]:pl-6 [&_ul_ul]:list-[circle]',
  '[&_ol]:my-3 [&_ol]:list-decimal [&_ol]:pl-6',
  '[&_li]:my-1 [&_li]:pl-1 [&_li>p]:my-0 [&_li_ol]:my-1 [&_li_ul]:my-1',
  '[&_blockquote]:my-4 [&_blockquote]:border-l-4 [&_blockquote]:border-paper-edge [&_blockquote]:pl-4 [&_blockquote]:italic [&_blockquote]:text-ink-soft',
  '[&_hr]:my-6 [&_hr]:border-t-2 [&_hr]:border-paper-edge',
  '[&_strong]:font-bold [&_em]:italic [&_u]:underline [&_s]:line-through',
].join(' ');
