import { useEffect, useId, useRef, useState } from 'react';
import { controlClass } from '../forms/form-field';

/** The filter above a table: what is typed reaches the URL (and so the server) after a short pause. */
export function SearchBox({ label, value, onSearch }: { label: string; value: string; onSearch: (q: string) => void }) {
  const id = useId();
  const [text, setText] = useState(value);
  const sent = useRef(value);

  // Back or a link changed the URL: show what it says.
  useEffect(() => {
    if (value !== sent.current) {
      sent.current = value;
      setText(value);
    }
  }, [value]);

  useEffect(() => {
    if (text.trim() === sent.current) return;
    const timer = setTimeout(() => {
      sent.current = text.trim();
      onSearch(text.trim());
    }, 300);
    return () => clearTimeout(timer);
  }, [text, onSearch]);

  return (
    <div role="search" className="grid min-w-0 gap-1 desk:max-w-measure">
      <label htmlFor={id} className="text-base font-medium desk:text-sm">
        {label}
      </label>
      <input id={id} type="search" value={text} onChange={(event) => setText(event.target.value)} className={controlClass} />
    </div>
  );
}
