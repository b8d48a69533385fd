import { useEffect, useId, useRef, useState } from "react";
import { Search, X } from "lucide-react";
import { useDebouncedValue } from "@/hooks/use-debounced-value";
import { cn } from "@/utils/cn";
import { controlClasses } from "./form/field";

/**
 * A search box that reports its text after the user pauses typing.
 * When `value` changes from outside (Back button, a cleared filter), the box follows it.
 */
export function SearchInput({
  label,
  value,
  onSearch,
  placeholder,
  className,
  delayMs = 300,
}: {
  label: string;
  value: string;
  onSearch: (text: string) => void;
  placeholder?: string;
  className?: string;
  delayMs?: number;
}) {
  const id = useId();
  const [text, setText] = useState(value);
  const debounced = useDebouncedValue(text, delayMs);
  const lastSent = useRef(value);

  // Follow the URL when it changes by other means.
  useEffect(() => {
    if (value !== lastSent.current) {
      lastSent.current = value;
      setText(value);
    }
  }, [value]);

  useEffect(() => {
    const next = debounced.trim();
    if (next !== lastSent.current.trim()) {
      lastSent.current = next;
      onSearch(next);
    }
  }, [debounced, onSearch]);

  return (
    <div className={cn("flex flex-col gap-1.5", className)}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-950">
        {label}
      </label>
      <div className="relative">
        <Search aria-hidden className="pointer-events-none absolute top-1/2 left-3 size-5 -translate-y-1/2 text-primer-600" />
        <input
          id={id}
          type="search"
          value={text}
          onChange={(e) => setText(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === "Enter") {
              lastSent.current = text.trim();
              onSearch(text.trim());
            }
          }}
          placeholder={placeholder}
          autoComplete="off"
          className={cn(controlClasses, "pr-11 pl-10 [&::-webkit-search-cancel-button]:hidden")}
        />
        {text ? (
          <button
            type="button"
            onClick={() => {
              setText("");
              lastSent.current = "";
              onSearch("");
            }}
            className="absolute top-1/2 right-1 grid size-10 -translate-y-1/2 place-items-center rounded-md text-primer-700 hover:bg-primer-100"
          >
            <X aria-hidden className="size-4" />
            <span className="sr-only">Clear search</span>
          </button>
        ) : null}
      </div>
    </div>
  );
}
