import { useEffect, useState } from 'react';
import { formatDateTime, formatLocalDateTime } from '~/lib/platform/format';

/**
 * A moment with its date and time of day: rendered in UTC on the server, then in the viewer's own
 * time zone once the browser runs it (the ISO instant stays in `datetime`).
 */
export function LocalTime({ at }: { at: string | Date }) {
  const iso = typeof at === 'string' ? new Date(at).toISOString() : at.toISOString();
  const [text, setText] = useState(() => formatDateTime(Date.parse(iso)));
  useEffect(() => setText(formatLocalDateTime(Date.parse(iso))), [iso]);
  return <time dateTime={iso}>{text}</time>;
}
