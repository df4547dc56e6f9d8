import { describe, expect, test } from 'vitest';
import { MAX_MESSAGE_ATTACHMENTS, messageRequestSchema, withdrawFormSchema } from '../../../src/lib/briefs/requests';

describe('a message with files', () => {
  test('names no files by default, and at most the limit', () => {
    expect(messageRequestSchema.parse({ body: 'Hello' })).toEqual({ body: 'Hello', attachmentIds: [] });
    const ids = Array.from({ length: MAX_MESSAGE_ATTACHMENTS + 1 }, (_, i) => `f${i}`);
    const tooMany = messageRequestSchema.safeParse({ body: 'Hello', attachmentIds: ids });
    expect(tooMany.error?.issues[0]?.message).toBe(`Attach at most ${MAX_MESSAGE_ATTACHMENTS} files to one message.`);
    expect(messageRequestSchema.safeParse({ body: 'Hello', attachmentIds: ids.slice(1) }).success).toBe(true);
  });
});

describe('withdrawing a brief', () => {
  test('takes the tick', () => {
    expect(withdrawFormSchema.safeParse({ intent: 'withdraw' }).error?.issues[0]?.path).toEqual(['confirm']);
    expect(withdrawFormSchema.safeParse({ intent: 'withdraw', confirm: 'yes' }).success).toBe(true);
  });
});
