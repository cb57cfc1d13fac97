import { forwardRef, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

export function Field({
  label,
  htmlFor,
  error,
  hint,
  children,
}: {
  label: ReactNode;
  htmlFor: string;
  error?: string;
  hint?: ReactNode;
  children: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={htmlFor} className="text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-xs text-ink-faint">{hint}</p>}
      {error && (
        <p id={`${htmlFor}-error`} className="text-sm text-changes">
          {error}
        </p>
      )}
    </div>
  );
}

const control =
  'w-full rounded-md border border-rule bg-paper-raised px-3 py-1.5 text-ink placeholder:text-ink-faint focus:border-copper focus:outline-none focus:ring-2 focus:ring-copper/25 aria-[invalid=true]:border-changes';

export const Input = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function Input({ className = '', ...props }, ref) {
  return <input ref={ref} {...props} className={`${control} ${className}`} />;
});

export const Select = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement>>(function Select(
  { className = '', ...props },
  ref,
) {
  return <select ref={ref} {...props} className={`${control} ${className}`} />;
});

export const TextArea = forwardRef<HTMLTextAreaElement, TextareaHTMLAttributes<HTMLTextAreaElement>>(function TextArea(
  { className = '', ...props },
  ref,
) {
  return <textarea ref={ref} {...props} className={`${control} ${className}`} />;
});
