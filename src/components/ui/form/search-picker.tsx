import { useId, useRef, useState, type ReactNode } from "react";
import { useQuery, type QueryKey, type UseQueryOptions } from "@tanstack/react-query";
import { ChevronDown, X } from "lucide-react";
import { useDebouncedValue } from "@/hooks/use-debounced-value";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "./field";

export type PickerOption = { id: string; name: string; detail?: string };
export type PickerPage = { options: PickerOption[]; total: number };
/** The query behind a picker for one search text (a feature's queryOptions factory). */
export type PickerQueryFor<K extends QueryKey = QueryKey> = (q: string) => UseQueryOptions<PickerPage, Error, PickerPage, K>;

/**
 * A searchable pick list (the ARIA combobox pattern: an input that pops up a listbox). Typing searches on the
 * server (the text goes to `queryFor`, debounced); arrow keys move through the matches, Enter picks, Escape closes
 * and puts back the chosen name. With `emptyLabel`, the first option clears the choice ("Anyone").
 */
export function SearchPicker<K extends QueryKey>({
  label,
  value,
  valueName,
  onChange,
  queryFor,
  emptyLabel,
  placeholder,
  noun,
  error,
  hint,
  required,
  className,
}: {
  label: ReactNode;
  /** The chosen id, "" for none. */
  value: string;
  /** The chosen option's name, shown in the box while it is closed. */
  valueName: string | null;
  onChange: (id: string, name: string | null) => void;
  /** The query for one search text; its data is one page of matches and how many there are in all. */
  queryFor: PickerQueryFor<K>;
  emptyLabel?: string;
  placeholder?: string;
  /** "customers": for "12 of 340 customers; keep typing to narrow". */
  noun: string;
  error?: string;
  hint?: ReactNode;
  required?: boolean;
  className?: string;
}) {
  const listId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [open, setOpen] = useState(false);
  const [text, setText] = useState("");
  const [active, setActive] = useState(0);
  const search = useDebouncedValue(text.trim(), 200);
  const results = useQuery({ ...queryFor(search), enabled: open });
  const matches = results.data?.options ?? [];
  const rows: PickerOption[] = emptyLabel && !search ? [{ id: "", name: emptyLabel }, ...matches] : matches;
  const optionId = (i: number) => `${listId}-option-${i}`;

  const close = () => {
    setOpen(false);
    setText("");
  };
  const pick = (o: PickerOption) => {
    onChange(o.id, o.id ? o.name : null);
    close();
  };
  const openList = () => {
    setOpen(true);
    setActive(0);
  };

  const onKeyDown = (e: React.KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "ArrowDown" || e.key === "ArrowUp") {
      e.preventDefault();
      if (!open) return openList();
      const step = e.key === "ArrowDown" ? 1 : -1;
      setActive((i) => (rows.length ? (i + step + rows.length) % rows.length : 0));
    } else if (e.key === "Enter" && open) {
      e.preventDefault();
      if (rows[active]) pick(rows[active]);
    } else if (e.key === "Escape" && open) {
      e.preventDefault();
      close();
    } else if (e.key === "Home" && open) {
      setActive(0);
    } else if (e.key === "End" && open) {
      setActive(Math.max(0, rows.length - 1));
    }
  };

  const more = results.data && results.data.total > matches.length;
  const status = !open
    ? ""
    : results.isPending
      ? "Searching…"
      : results.error
        ? results.error.message
        : matches.length === 0
          ? `No ${noun} match “${search}”.`
          : more
            ? `${matches.length} of ${results.data!.total} ${noun}; type to narrow.`
            : `${matches.length} ${matches.length === 1 ? noun.replace(/s$/, "") : noun}.`;

  return (
    <Field label={label} error={error} hint={hint} required={required} className={className}>
      {(control) => (
        <div className="relative">
          <input
            ref={inputRef}
            {...control}
            type="text"
            role="combobox"
            autoComplete="off"
            aria-autocomplete="list"
            aria-expanded={open}
            aria-controls={listId}
            aria-activedescendant={open && rows[active] ? optionId(active) : undefined}
            value={open ? text : (valueName ?? "")}
            placeholder={open ? (valueName ?? placeholder) : (placeholder ?? emptyLabel)}
            onChange={(e) => {
              setText(e.target.value);
              if (!open) setOpen(true);
              setActive(0);
            }}
            onFocus={openList}
            onClick={() => (open ? null : openList())}
            onBlur={close}
            onKeyDown={onKeyDown}
            className={cn(controlClasses, "pr-16")}
          />
          <span className="absolute top-1/2 right-2 flex -translate-y-1/2 items-center gap-1">
            {value && !required ? (
              <button
                type="button"
                aria-label={`Clear ${typeof label === "string" ? label.toLowerCase() : "the choice"}`}
                className="rounded p-1 text-primer-700 hover:bg-primer-100"
                onMouseDown={(e) => e.preventDefault()}
                onClick={() => onChange("", null)}
              >
                <X aria-hidden className="size-4" />
              </button>
            ) : null}
            <ChevronDown aria-hidden className="pointer-events-none size-4 text-primer-700" />
          </span>
          <ul
            id={listId}
            role="listbox"
            aria-label={typeof label === "string" ? label : undefined}
            hidden={!open}
            className="absolute z-20 mt-1 max-h-72 w-full overflow-y-auto rounded-lg border border-primer-300 bg-white py-1 shadow-card"
          >
            {rows.map((o, i) => (
              <li
                key={o.id || "empty"}
                id={optionId(i)}
                role="option"
                aria-selected={o.id === value}
                className={cn("flex cursor-pointer flex-col px-3 py-2 text-base text-ink-950", i === active && "bg-primer-100", o.id === value && "font-semibold")}
                onMouseDown={(e) => e.preventDefault()}
                onMouseEnter={() => setActive(i)}
                onClick={() => pick(o)}
              >
                {o.name}
                {o.detail ? <span className="text-sm font-normal text-primer-700">{o.detail}</span> : null}
              </li>
            ))}
          </ul>
          <p role="status" className={cn("text-sm text-primer-700", open ? "mt-1" : "sr-only")}>
            {status}
          </p>
        </div>
      )}
    </Field>
  );
}
