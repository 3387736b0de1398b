import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "ghost";

const variants: Record<Variant, string> = {
  primary: "bg-flux-700 text-white hover:bg-flux-800 disabled:bg-steel-400",
  secondary:
    "border border-steel-300 bg-white text-steel-900 hover:bg-steel-100 disabled:text-steel-500",
  danger: "border border-danger-600 bg-white text-danger-700 hover:bg-danger-50",
  ghost: "text-flux-700 hover:bg-flux-50",
};

export function buttonClass(variant: Variant = "primary", size: "md" | "sm" = "md") {
  const sizing = size === "sm" ? "px-2.5 py-1 text-small" : "px-4 py-2 text-body";
  return `inline-flex items-center justify-center gap-2 rounded-md font-bold transition-colors disabled:cursor-not-allowed ${sizing} ${variants[variant]}`;
}

export function Button({
  variant = "primary",
  size = "md",
  className = "",
  type = "button",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: "md" | "sm" }) {
  return <button type={type} className={`${buttonClass(variant, size)} ${className}`} {...props} />;
}
