/** `?a=1&b=x` from a flat query object, leaving out undefined and empty values; '' when nothing is left. */
export function searchString(query: object): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}
