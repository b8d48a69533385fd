import { forwardRef, type ButtonHTMLAttributes, type ReactNode } from "react";
import { Link, type LinkProps } from "react-router";
import { LoaderCircle } from "lucide-react";
import { cn } from "@/utils/cn";

export type ButtonVariant = "primary" | "secondary" | "ghost" | "danger" | "dark";
export type ButtonSize = "sm" | "md" | "lg";

const VARIANTS: Record<ButtonVariant, string> = {
  primary: "bg-candy-600 text-white shadow-card hover:bg-candy-700 active:bg-candy-800",
  secondary: "border border-primer-300 bg-white text-ink-950 shadow-card hover:bg-primer-100 active:bg-primer-200",
  ghost: "text-ink-900 hover:bg-primer-200/70 active:bg-primer-200 aria-pressed:bg-ink-100 aria-pressed:text-ink-950",
  danger: "border border-red-700 bg-white text-red-800 hover:bg-red-50 active:bg-red-100",
  dark: "bg-ink-900 text-white hover:bg-ink-800 active:bg-ink-700",
};

// sm is for dense rows only; main actions use md (44px) or lg (48px).
const SIZES: Record<ButtonSize, string> = {
  sm: "min-h-10 px-3 text-sm gap-1.5",
  md: "min-h-11 px-4 text-sm gap-2",
  lg: "min-h-12 px-5 text-base gap-2",
};

export function buttonClasses({
  variant = "primary",
  size = "md",
  block = false,
  className,
}: { variant?: ButtonVariant; size?: ButtonSize; block?: boolean; className?: string } = {}) {
  return cn(
    "inline-flex select-none items-center justify-center rounded-lg font-semibold transition-colors",
    "disabled:cursor-not-allowed disabled:opacity-55 aria-disabled:cursor-not-allowed aria-disabled:opacity-55",
    VARIANTS[variant],
    SIZES[size],
    block && "w-full",
    className,
  );
}

type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
  block?: boolean;
  /** Shows a spinner and disables the button. */
  pending?: boolean;
  icon?: ReactNode;
};

export const Button = forwardRef<HTMLButtonElement, ButtonProps>(function Button(
  { variant, size, block, pending = false, icon, className, children, disabled, type = "button", ...rest },
  ref,
) {
  return (
    <button
      ref={ref}
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={buttonClasses({ variant, size, block, className })}
      {...rest}
    >
      {pending ? <LoaderCircle aria-hidden className="size-4 animate-spin" /> : icon}
      {children}
    </button>
  );
});

type ButtonLinkProps = LinkProps & { variant?: ButtonVariant; size?: ButtonSize; block?: boolean; icon?: ReactNode };

export function ButtonLink({ variant, size, block, icon, className, children, ...rest }: ButtonLinkProps) {
  return (
    <Link className={buttonClasses({ variant, size, block, className: typeof className === "string" ? className : undefined })} {...rest}>
      {icon}
      {children}
    </Link>
  );
}
