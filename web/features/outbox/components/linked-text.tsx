import { Fragment } from 'react';

const LINK = /(https?:\/\/[^\s<>"')\]]+)/g;

/** Plain mail text with its web addresses made into links; everything else stays text. */
export function LinkedText({ text }: { text: string }) {
  const parts = text.split(LINK);
  return (
    <>
      {parts.map((part, index) =>
        index % 2 === 1 ? (
          <a key={index} href={part} className="break-all">
            {part}
          </a>
        ) : (
          <Fragment key={index}>{part}</Fragment>
        ),
      )}
    </>
  );
}
