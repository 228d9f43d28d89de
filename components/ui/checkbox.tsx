import { forwardRef } from "react";

/** The app's checkbox: the accent colour, a 20 px box inside a target of at least 24 px (44 px on touch screens). */
export const Checkbox = forwardRef<HTMLInputElement, Omit<React.InputHTMLAttributes<HTMLInputElement>, "type">>(function Checkbox({ className = "", ...props }, ref) {
  return <input ref={ref} type="checkbox" className={`jb-check h-5 w-5 shrink-0 accent-chalk-600 ${className}`} {...props} />;
});

/** A checkbox with its label beside it, the whole row clickable. */
export const CheckboxLabel = forwardRef<HTMLInputElement, Omit<React.InputHTMLAttributes<HTMLInputElement>, "type"> & { label: React.ReactNode }>(function CheckboxLabel({ label, className = "", ...props }, ref) {
  return (
    <label className={`jb-tap inline-flex items-center gap-2 rounded-plank px-1 hover:bg-timber-100 ${className}`}>
      <Checkbox ref={ref} {...props} />
      <span>{label}</span>
    </label>
  );
});
