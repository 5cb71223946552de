// Addresses end at whitespace or an angle bracket; trailing punctuation belongs to the sentence.
const urlPattern = /https?:\/\/[^\s<>"]+[^\s<>".,;:!?)\]'’]/g;

/** Plain text with its web addresses as links. Only text is rendered: nothing in a message becomes markup. */
export function LinkedText({ text }: { text: string }) {
  const parts: (string | { url: string })[] = [];
  let last = 0;
  for (const match of text.matchAll(urlPattern)) {
    parts.push(text.slice(last, match.index), { url: match[0] });
    last = match.index + match[0].length;
  }
  parts.push(text.slice(last));
  return (
    <pre className="whitespace-pre-wrap break-words font-sans text-body text-ink-900">
      {parts.map((part, index) =>
        typeof part === 'string' ? (
          part
        ) : (
          <a
            key={index}
            href={part.url}
            rel="noreferrer noopener"
            className="font-bold text-ink-700 underline decoration-glow-400 underline-offset-4 hover:text-ink-950"
          >
            {part.url}
          </a>
        ),
      )}
    </pre>
  );
}
