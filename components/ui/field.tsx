import { forwardRef, useId } from "react";

export function FieldError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-sm text-fault-700" role="alert">
      {message}
    </p>
  );
}

type InputProps = React.InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string };

export const TextField = forwardRef<HTMLInputElement, InputProps>(function TextField({ label, error, hint, className = "", ...props }, ref) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium text-walnut-800">
        {label}
      </label>
      {hint ? <p className="text-xs text-walnut-600">{hint}</p> : null}
      <input
        ref={ref}
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        className="mt-1 w-full rounded-plank border border-timber-300 bg-white px-2 py-1.5 text-walnut-900 aria-[invalid]:border-fault-700"
        {...props}
      />
      <FieldError id={`${id}-err`} message={error} />
    </div>
  );
});

type SelectProps = React.SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string };

export const SelectField = forwardRef<HTMLSelectElement, SelectProps>(function SelectField({ label, error, className = "", children, ...props }, ref) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium text-walnut-800">
        {label}
      </label>
      <select
        ref={ref}
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        className="mt-1 w-full rounded-plank border border-timber-300 bg-white px-2 py-1.5"
        {...props}
      >
        {children}
      </select>
      <FieldError id={`${id}-err`} message={error} />
    </div>
  );
});

export function Notice({ tone = "info", children }: { tone?: "info" | "error" | "ok"; children: React.ReactNode }) {
  const cls =
    tone === "error"
      ? "border-fault-700 bg-fault-100 text-fault-900"
      : tone === "ok"
        ? "border-pass-600 bg-pass-100 text-pass-900"
        : "border-chalk-600 bg-chalk-100 text-chalk-700";
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-plank border-l-4 px-3 py-2 text-sm ${cls}`}>
      {children}
    </div>
  );
}
