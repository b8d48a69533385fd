import { useSyncExternalStore } from "react";

export type ToastTone = "success" | "error" | "info";
export type Toast = { id: number; tone: ToastTone; message: string };

let toasts: Toast[] = [];
let nextId = 1;
const listeners = new Set<() => void>();
const emit = () => listeners.forEach((l) => l());

export function dismissToast(id: number) {
  toasts = toasts.filter((t) => t.id !== id);
  emit();
}

function push(tone: ToastTone, message: string) {
  // The same message twice in a row (e.g. several queries failing at once) shows once.
  if (toasts.some((t) => t.message === message)) return;
  const id = nextId++;
  toasts = [...toasts.slice(-3), { id, tone, message }];
  emit();
  window.setTimeout(() => dismissToast(id), tone === "error" ? 8000 : 4500);
}

/** Short notices that do not need an answer: saved, moved, a background refresh failed. */
export const toast = {
  success: (message: string) => push("success", message),
  error: (message: string) => push("error", message),
  info: (message: string) => push("info", message),
};

export function useToasts(): Toast[] {
  return useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => toasts,
  );
}
