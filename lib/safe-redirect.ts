/** Only same-site paths may follow sign-in: "/c/…" yes; "//host", "/\\host" and full URLs no. */
export function safeCallbackPath(value: string | null | undefined): string {
  if (!value || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\") || /[\u0000-\u001f]/.test(value)) return "/";
  return value;
}
