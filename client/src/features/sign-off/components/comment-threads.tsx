import { useState } from 'react';
import { Badge, Button, Group, NativeSelect, Paper, Stack, Text, Textarea, Title } from '@mantine/core';
import type { CommentAnchor, ReviewComment } from '@ladderwright/shared/api';
import { anchorFromValue, type AnchorOptions } from '../anchor-options';
import { useComments } from '../api/get-comments';
import { useCreateComment } from '../api/create-comment';
import { useUpdateComment } from '../api/update-comment';
import { SignOffError } from './sign-off-error';
import { formatDateTime } from '../../../lib/format-date';
import { documentFieldLabel, resultFieldLabel } from '@ladderwright/shared/designs';

export interface CommentThreadsProps {
  projectId: string;
  designId: string;
  revisionNumber: number;
  anchorOptions: AnchorOptions;
  canComment: boolean;
}

function anchorLabel(anchor: CommentAnchor): string {
  return anchor.kind === 'input'
    ? `input · ${documentFieldLabel(anchor.path).label}`
    : `result · ${resultFieldLabel(anchor.path).label}`;
}

function byline(comment: ReviewComment): string {
  return `${comment.authorName} · ${formatDateTime(comment.createdAt)}`;
}

/** The revision's comment threads (one level of replies), a new thread with an optional anchor, resolve/reopen. */
export function CommentThreads({
  projectId,
  designId,
  revisionNumber,
  anchorOptions,
  canComment,
}: CommentThreadsProps) {
  const comments = useComments(projectId, designId, revisionNumber);
  return (
    <Stack gap="sm">
      <Title order={2} size="h4">
        Comments
      </Title>
      {comments.isPending && <Text size="sm">Loading comments…</Text>}
      <SignOffError error={comments.error} fallbackTitle="Comments could not be loaded" />
      {comments.data?.length === 0 && (
        <Text size="sm" c="dimmed">
          No comments on this revision yet.
        </Text>
      )}
      {comments.data?.map((thread) => (
        <CommentThread
          key={thread.id}
          thread={thread}
          projectId={projectId}
          designId={designId}
          revisionNumber={revisionNumber}
          canComment={canComment}
        />
      ))}
      {canComment && (
        <NewThreadForm
          projectId={projectId}
          designId={designId}
          revisionNumber={revisionNumber}
          anchorOptions={anchorOptions}
        />
      )}
    </Stack>
  );
}

interface ThreadProps {
  thread: ReviewComment;
  projectId: string;
  designId: string;
  revisionNumber: number;
  canComment: boolean;
}

function CommentThread({ thread, projectId, designId, revisionNumber, canComment }: ThreadProps) {
  const [reply, setReply] = useState('');
  const create = useCreateComment(projectId, designId, revisionNumber);
  const update = useUpdateComment(projectId, designId, revisionNumber);
  const firstLine = thread.body.split('\n')[0] ?? '';
  return (
    <Paper withBorder p="sm" component="article" aria-label={`Thread: ${firstLine.slice(0, 60)}`}>
      <Group gap="xs" mb={4}>
        {thread.anchor && (
          <Badge variant="outline" radius="sm" tt="none" ff="monospace">
            {anchorLabel(thread.anchor)}
          </Badge>
        )}
        <Badge variant="light" color={thread.isResolved ? 'verdigris' : 'gray'} radius="sm" tt="none">
          {thread.isResolved ? `resolved${thread.resolvedByName ? ` by ${thread.resolvedByName}` : ''}` : 'open'}
        </Badge>
      </Group>
      <Text size="sm" style={{ whiteSpace: 'pre-wrap' }}>
        {thread.body}
      </Text>
      <Text size="xs" c="dimmed">
        {byline(thread)}
      </Text>
      {thread.replies.map((answer) => (
        <Stack
          key={answer.id}
          gap={0}
          pl="md"
          mt="xs"
          style={{ borderLeft: '2px solid var(--mantine-color-default-border)' }}
        >
          <Text size="sm" style={{ whiteSpace: 'pre-wrap' }}>
            {answer.body}
          </Text>
          <Text size="xs" c="dimmed">
            {byline(answer)}
          </Text>
        </Stack>
      ))}
      {canComment && (
        <Stack gap="xs" mt="sm">
          <Textarea
            aria-label="Reply"
            placeholder="Reply to this thread"
            rows={1}
            value={reply}
            onChange={(event) => setReply(event.currentTarget.value)}
          />
          <Group gap="xs">
            <Button
              size="xs"
              variant="default"
              disabled={reply.trim() === ''}
              loading={create.isPending}
              onClick={() =>
                create.mutate({ body: reply.trim(), parentId: thread.id }, { onSuccess: () => setReply('') })
              }
            >
              Reply
            </Button>
            <Button
              size="xs"
              variant="subtle"
              loading={update.isPending}
              onClick={() => update.mutate({ commentId: thread.id, request: { isResolved: !thread.isResolved } })}
            >
              {thread.isResolved ? 'Reopen' : 'Resolve'}
            </Button>
          </Group>
          <SignOffError error={create.error ?? update.error} fallbackTitle="The thread did not change" />
        </Stack>
      )}
    </Paper>
  );
}

interface NewThreadFormProps {
  projectId: string;
  designId: string;
  revisionNumber: number;
  anchorOptions: AnchorOptions;
}

function NewThreadForm({ projectId, designId, revisionNumber, anchorOptions }: NewThreadFormProps) {
  const [body, setBody] = useState('');
  const [anchor, setAnchor] = useState('');
  const create = useCreateComment(projectId, designId, revisionNumber);
  const selectData = [
    { value: '', label: 'No anchor (whole revision)' },
    {
      group: 'Input fields',
      items: anchorOptions.inputPaths.map((path) => ({
        value: `input:${path}`,
        label: documentFieldLabel(path).label,
      })),
    },
    {
      group: 'Results',
      items: anchorOptions.resultKeys.map((key) => ({ value: `result:${key}`, label: resultFieldLabel(key).label })),
    },
  ];
  const send = () => {
    const chosen = anchorFromValue(anchor);
    create.mutate(
      { body: body.trim(), ...(chosen ? { anchor: chosen } : {}) },
      {
        onSuccess: () => {
          setBody('');
          setAnchor('');
        },
      },
    );
  };
  return (
    <Paper withBorder p="sm">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          send();
        }}
      >
        <Stack gap="xs">
          <Textarea
            label="New comment"
            placeholder="A question or a finding about this revision"
            rows={2}
            value={body}
            onChange={(event) => setBody(event.currentTarget.value)}
          />
          <NativeSelect
            label="Anchor"
            description="Optional: the input field or result the comment is about"
            data={selectData}
            value={anchor}
            onChange={(event) => setAnchor(event.currentTarget.value)}
          />
          <Group>
            <Button type="submit" size="sm" disabled={body.trim() === ''} loading={create.isPending}>
              Start thread
            </Button>
          </Group>
          <SignOffError error={create.error} fallbackTitle="The comment was not saved" />
        </Stack>
      </form>
    </Paper>
  );
}
