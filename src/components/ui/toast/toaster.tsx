import { CircleAlert, CircleCheck, Info, X } from "lucide-react";
import { cn } from "@/utils/cn";
import { dismissToast, useToasts, type ToastTone } from "./toast-store";

const TONE: Record<ToastTone, { className: string; Icon: typeof Info }> = {
  success: { className: "border-emerald-700 bg-emerald-50 text-emerald-950", Icon: CircleCheck },
  error: { className: "border-red-700 bg-red-50 text-red-950", Icon: CircleAlert },
  info: { className: "border-ink-600 bg-white text-ink-950", Icon: Info },
};

export function Toaster() {
  const toasts = useToasts();
  return (
    <div
      aria-live="polite"
      aria-atomic="false"
      className="pointer-events-none fixed inset-x-0 bottom-0 z-50 flex flex-col items-center gap-2 p-4 sm:items-end"
    >
      {toasts.map(({ id, tone, message }) => {
        const { className, Icon } = TONE[tone];
        return (
          <div
            key={id}
            role={tone === "error" ? "alert" : "status"}
            className={cn(
              "pointer-events-auto flex w-full max-w-sm items-start gap-3 rounded-lg border-l-4 px-4 py-3 shadow-raised",
              className,
            )}
          >
            <Icon aria-hidden className="mt-0.5 size-5 shrink-0" />
            <p className="flex-1 text-sm font-medium">{message}</p>
            <button
              type="button"
              onClick={() => dismissToast(id)}
              className="-my-2 -mr-2 grid size-10 shrink-0 place-items-center rounded-md hover:bg-black/5"
            >
              <X aria-hidden className="size-4" />
              <span className="sr-only">Dismiss</span>
            </button>
          </div>
        );
      })}
    </div>
  );
}
