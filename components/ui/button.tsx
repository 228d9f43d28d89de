import { forwardRef } from "react";

type Variant = "primary" | "plain" | "quiet" | "danger";

const styles: Record<Variant, string> = {
  primary: "bg-chalk-600 text-white hover:bg-chalk-700 border border-chalk-700",
  plain: "bg-white text-walnut-900 border border-timber-300 hover:bg-timber-100",
  quiet: "bg-transparent text-walnut-800 hover:bg-timber-100 border border-transparent",
  danger: "bg-white text-fault-700 border border-fault-700 hover:bg-fault-100",
};

export const Button = forwardRef<HTMLButtonElement, React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }>(
  function Button({ variant = "plain", className = "", ...props }, ref) {
    return (
      <button
        ref={ref}
        className={`inline-flex items-center justify-center gap-1 rounded-plank px-3 py-1.5 text-sm font-medium disabled:opacity-50 ${styles[variant]} ${className}`}
        {...props}
      />
    );
  },
);
