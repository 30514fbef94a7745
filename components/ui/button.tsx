import Link from "next/link";
import type { ButtonHTMLAttributes, ReactNode } from "react";

const styles = {
  primary: "bg-basin-600 text-white hover:bg-basin-700 disabled:bg-basin-300",
  secondary: "border border-line-strong bg-paper-raised text-ink hover:bg-paper-sunk",
  danger: "bg-danger-600 text-white hover:bg-danger-700",
  ghost: "text-basin-700 hover:bg-basin-50",
} as const;
export type ButtonVariant = keyof typeof styles;

const base = "inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed";

export function Button({ variant = "primary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant }) {
  return <button className={`${base} ${styles[variant]} ${className}`} {...props} />;
}

export function ButtonLink({ href, variant = "primary", children, className = "" }: { href: string; variant?: ButtonVariant; children: ReactNode; className?: string }) {
  return (
    <Link href={href} className={`${base} ${styles[variant]} ${className}`}>
      {children}
    </Link>
  );
}
