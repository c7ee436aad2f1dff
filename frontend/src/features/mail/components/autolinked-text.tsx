import { Fragment } from 'react';

const URL_PATTERN = /(https?:\/\/[^\s<>"']+[^\s<>"'.,;:!?)\]])/g;

/** Plain text with its web addresses turned into links that open in this tab. */
export function AutolinkedText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <pre className="font-sans text-small leading-6 break-words whitespace-pre-wrap text-ink-800">
      {parts.map((part, index) =>
        index % 2 === 1 ? (
          <a key={index} href={part} className="font-semibold break-all text-frost-600 underline hover:text-frost-700">
            {part}
          </a>
        ) : (
          <Fragment key={index}>{part}</Fragment>
        ),
      )}
    </pre>
  );
}
