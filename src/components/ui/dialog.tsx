import { useEffect, useId, useRef, type ReactNode } from "react";
import { X } from "lucide-react";
import { cn } from "@/utils/cn";

/**
 * A modal on the native <dialog>: focus moves in and is kept there, Escape closes it,
 * and focus returns to the opener. Render it only while open.
 */
export function Dialog({
  title,
  description,
  onClose,
  children,
  size = "md",
}: {
  title: ReactNode;
  description?: ReactNode;
  onClose: () => void;
  children: ReactNode;
  size?: "md" | "lg";
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    const opener = document.activeElement as HTMLElement | null;
    if (!dialog.open) dialog.showModal();
    return () => {
      dialog.close();
      // Back to the opener; if it is gone (the card moved to another column), to the page content.
      if (opener?.isConnected) opener.focus();
      else document.getElementById("main")?.focus({ preventScroll: true });
    };
  }, []);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onClick={(e) => {
        // A click on the backdrop (the dialog element itself, outside its content box) closes it.
        if (e.target === e.currentTarget) onClose();
      }}
      className={cn(
        "m-auto w-[calc(100%-1.5rem)] rounded-2xl bg-white p-0 text-ink-950 shadow-raised",
        size === "lg" ? "max-w-2xl" : "max-w-lg",
        "max-h-[calc(100dvh-2rem)]",
      )}
    >
      <div className="flex items-start justify-between gap-4 border-b border-primer-200 px-5 py-4">
        <div>
          <h2 id={titleId} className="text-lg font-semibold">
            {title}
          </h2>
          {description ? (
            <p id={descriptionId} className="mt-0.5 text-sm text-primer-700">
              {description}
            </p>
          ) : null}
        </div>
        <button
          type="button"
          onClick={onClose}
          className="-mr-2 -mt-1 grid size-11 shrink-0 place-items-center rounded-lg text-primer-700 hover:bg-primer-100"
        >
          <X aria-hidden className="size-5" />
          <span className="sr-only">Close</span>
        </button>
      </div>
      <div className="px-5 py-4">{children}</div>
    </dialog>
  );
}
