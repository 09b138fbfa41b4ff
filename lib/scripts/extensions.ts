import type { Extensions } from '@tiptap/core';
import { StarterKit } from '@tiptap/starter-kit';

// One list for the editor, the schema check and the server renderer, so what the editor can write is
// exactly what the server accepts and renders. Nothing here touches the DOM when imported (the
// server renderer imports it); the editor adds Placeholder on its own.
export const scriptExtensions: Extensions = [
  StarterKit.configure({
    heading: { levels: [2, 3] },
    // A script is read aloud: links and code have no place in it, and links would need URL vetting.
    link: false,
    code: false,
    codeBlock: false,
  }),
];
