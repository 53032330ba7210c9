import { useState, type ReactNode } from 'react';
import { Alert, App, Button, Flex, Form, Input, Tabs } from 'antd';
import { FLAG_LIMITS, type FlagDetail, type UpdateFlagRequest } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { useCurrentProject } from '@/lib/current-project';
import { useCurrentUser } from '@/lib/current-user';
import { showFieldErrors } from '@/lib/form-errors';
import { can } from '@/lib/roles';
import { answerFlag } from '../api/answer-flag';
import { closeFlag } from '../api/close-flag';
import { commentFlag } from '../api/comment-flag';
import { reopenFlag } from '../api/reopen-flag';
import { updateFlag } from '../api/update-flag';
import { staleFlagOf, useFlagChange } from '../api/use-flag-change';
import { waiveFlag } from '../api/waive-flag';
import { EngineerSelect } from './engineer-select';

/**
 * Called when a change was refused because the flag had moved on: `current`
 * is the flag as it is now, `text` what the person wrote (kept for them).
 */
export type OnStale = (current: FlagDetail, action: string, text?: string) => void;

export type FlagActionKey = 'answer' | 'close' | 'reopen' | 'waive' | 'assign';

const ACTIVE = (f: FlagDetail) => f.status === 'open' || f.status === 'answered';

/** The changes the signed-in person may make to this flag now (role and status), as issue 5 and flags.ts say. */
export function allowedActions(flag: FlagDetail, me: ReturnType<typeof useCurrentUser>, myRole: ReturnType<typeof useCurrentProject>['myRole']): FlagActionKey[] {
  const out: FlagActionKey[] = [];
  if (flag.status === 'open' && can.answerFlag(me, myRole, flag.assignee?.id)) out.push('answer');
  if (ACTIVE(flag) && can.closeFlags(myRole)) out.push('close');
  if (!ACTIVE(flag) && can.closeFlags(myRole)) out.push('reopen');
  if (ACTIVE(flag) && can.manageFlags(myRole)) out.push('waive');
  if (ACTIVE(flag) && can.manageFlags(myRole)) out.push('assign');
  return out;
}

const bodyRules = (requiredMessage: string | undefined) => [
  ...(requiredMessage ? [{ required: true, whitespace: true, message: requiredMessage }] : []),
  { max: FLAG_LIMITS.bodyMax, message: `At most ${FLAG_LIMITS.bodyMax} characters.` },
];

/**
 * One text form of a flag change (answer, close, reopen, waive, comment). The
 * text stays in the box when the change is refused, so nothing typed is lost.
 */
function TextActionForm({
  name,
  label,
  field,
  placeholder,
  required,
  submitText,
  danger,
  onSubmit,
  ariaLabel,
  extra,
}: {
  /** Prefixes the fields' ids, so several forms on the page never share one. */
  name: string;
  label: string;
  field: 'body' | 'reason';
  placeholder: string;
  /** The message when it is left empty; undefined when optional. */
  required?: string;
  submitText: string;
  danger?: boolean;
  ariaLabel: string;
  extra?: ReactNode;
  /** Resolves true when done (the text is cleared), false when refused. */
  onSubmit: (text: string, form: ReturnType<typeof Form.useForm<Record<string, string>>>[0]) => Promise<boolean>;
}) {
  const [form] = Form.useForm<Record<string, string>>();
  const [busy, setBusy] = useState(false);
  return (
    <Form
      form={form}
      name={name}
      layout="vertical"
      requiredMark={false}
      aria-label={ariaLabel}
      disabled={busy}
      onFinish={async (v) => {
        setBusy(true);
        try {
          if (await onSubmit((v[field] ?? '').trim(), form)) form.resetFields();
        } finally {
          setBusy(false);
        }
      }}
    >
      {extra}
      <Form.Item label={label} name={field} rules={bodyRules(required)}>
        <Input.TextArea rows={3} placeholder={placeholder} />
      </Form.Item>
      <Button type="primary" danger={danger} htmlType="submit" loading={busy}>
        {submitText}
      </Button>
    </Form>
  );
}

interface AssignValues {
  assigneeId: number | null;
  dueDate: string;
}

/** Reassign and/or move the due date (checkers, managers), with the version seen. */
function AssignForm({ flag, submit }: { flag: FlagDetail; submit: (body: UpdateFlagRequest, form: ReturnType<typeof Form.useForm<AssignValues>>[0]) => Promise<boolean> }) {
  const project = useCurrentProject();
  const [form] = Form.useForm<AssignValues>();
  const [busy, setBusy] = useState(false);
  return (
    <Form<AssignValues>
      form={form}
      name="assign"
      layout="vertical"
      requiredMark={false}
      aria-label="Reassign or change the due date"
      disabled={busy}
      initialValues={{ assigneeId: flag.assignee?.id ?? null, dueDate: flag.dueDate ?? '' }}
      onFinish={async (v) => {
        const body: UpdateFlagRequest = { version: flag.version };
        if ((v.assigneeId ?? null) !== (flag.assignee?.id ?? null)) body.assigneeId = v.assigneeId ?? null;
        if ((v.dueDate || null) !== flag.dueDate) body.dueDate = v.dueDate || null;
        if (body.assigneeId === undefined && body.dueDate === undefined) {
          form.setFields([{ name: 'assigneeId', errors: ['Choose another assignee or another due date first.'] }]);
          return;
        }
        setBusy(true);
        try {
          await submit(body, form);
        } finally {
          setBusy(false);
        }
      }}
    >
      <Flex gap={12} wrap>
        <Form.Item label="Assignee" name="assigneeId" style={{ flex: '1 1 220px' }}>
          <EngineerSelect projectId={project.id} aria-label="Assignee" />
        </Form.Item>
        <Form.Item label="Due date" name="dueDate" style={{ flex: '1 1 160px' }} extra="Empty: no due date.">
          <Input type="date" aria-label="Due date" />
        </Form.Item>
      </Flex>
      <Button type="primary" htmlType="submit" loading={busy}>
        Save
      </Button>
    </Form>
  );
}

/**
 * The changes the signed-in person may make to the flag, one tab each. Every
 * change carries the version on screen; a refusal because someone else got
 * there first goes to `onStale` with the current flag.
 */
export function FlagActions({ flag, onStale, onChanged }: { flag: FlagDetail; onStale: OnStale; onChanged: () => void }) {
  const me = useCurrentUser();
  const project = useCurrentProject();
  const { message } = App.useApp();
  const { run } = useFlagChange(project.id, flag.id);
  const [problem, setProblem] = useState<string | null>(null);
  const actions = allowedActions(flag, me, project.myRole);

  /** Runs one change; true when it went through. */
  const change = async <F extends object>(
    action: string,
    call: () => Promise<FlagDetail>,
    done: string,
    form?: { inst: ReturnType<typeof Form.useForm<F>>[0]; fields: (keyof F & string)[] },
    text?: string,
  ): Promise<boolean> => {
    setProblem(null);
    try {
      await run(call);
      void message.success(done);
      onChanged();
      return true;
    } catch (e) {
      const current = staleFlagOf(e);
      if (current) onStale(current, action, text);
      else if (isApiError(e) && e.code === 'CONFLICT') setProblem(e.message);
      else if (!(form && showFieldErrors(form.inst, e, form.fields))) setProblem(errorMessage(e));
      return false;
    }
  };

  if (actions.length === 0) return null;
  const pid = project.id;
  const v = flag.version;
  const items = [
    actions.includes('answer') && {
      key: 'answer',
      label: 'Answer',
      children: (
        <TextActionForm
          name="answer"
          ariaLabel="Answer the flag"
          label="Answer"
          field="body"
          required="Write your answer: what was changed, or why the member is fine."

          placeholder="What was done: a new section, camber, or why the member is fine as it is."
          submitText="Send answer"
          onSubmit={(body, f) => change('answer', () => answerFlag(pid, flag.id, { version: v, body }), 'Answer sent; the checker will close or reopen the flag.', { inst: f, fields: ['body'] }, body)}
        />
      ),
    },
    actions.includes('close') && {
      key: 'close',
      label: 'Close',
      children: (
        <TextActionForm
          name="close"
          ariaLabel="Close the flag"
          label="Comment (optional)"
          field="body"
          placeholder="Why it is resolved."
          submitText="Close flag"
          onSubmit={(body, f) => change('closing', () => closeFlag(pid, flag.id, { version: v, ...(body ? { body } : {}) }), 'Flag closed.', { inst: f, fields: ['body'] }, body)}
        />
      ),
    },
    actions.includes('reopen') && {
      key: 'reopen',
      label: 'Reopen',
      children: (
        <TextActionForm
          name="reopen"
          ariaLabel="Reopen the flag"
          label="Why reopen"
          field="body"
          required="Say what still needs doing: reopening needs a comment."

          placeholder="What still needs doing."
          submitText="Reopen flag"
          onSubmit={(body, f) => change('reopening', () => reopenFlag(pid, flag.id, { version: v, body }), 'Flag reopened.', { inst: f, fields: ['body'] }, body)}
        />
      ),
    },
    actions.includes('waive') && {
      key: 'waive',
      label: 'Waive',
      children: (
        <TextActionForm
          name="waive"
          ariaLabel="Waive the flag"
          label="Reason"
          field="reason"
          required="Give the reason for waiving the flag."

          danger
          placeholder="Why the member is accepted as it is (e.g. the engineer of record accepts the deflection of this lintel)."
          submitText="Waive flag"
          onSubmit={(reason, f) => change('waiver', () => waiveFlag(pid, flag.id, { version: v, reason }), 'Flag waived.', { inst: f, fields: ['reason'] }, reason)}
        />
      ),
    },
    actions.includes('assign') && {
      key: 'assign',
      label: 'Assignee and due date',
      children: (
        <AssignForm
          key={flag.version}
          flag={flag}
          submit={(body, f) => change('change of assignee or due date', () => updateFlag(pid, flag.id, body), 'Saved.', { inst: f, fields: ['assigneeId', 'dueDate'] })}
        />
      ),
    },
  ].filter((x) => x !== false);

  return (
    <Flex vertical gap={8}>
      <Tabs items={items} size="small" />
      {problem && <Alert type="error" showIcon title={problem} closable={{ onClose: () => setProblem(null) }} />}
    </Flex>
  );
}

/** The comment box under the thread (everyone but viewers). Comments carry no version: they overwrite nothing. */
export function FlagCommentForm({ flag, onChanged }: { flag: FlagDetail; onChanged: () => void }) {
  const project = useCurrentProject();
  const { run } = useFlagChange(project.id, flag.id);
  const [problem, setProblem] = useState<string | null>(null);
  if (!can.commentOnFlags(project.myRole)) return null;
  return (
    <Flex vertical gap={8}>
      <TextActionForm
        name="comment"
        ariaLabel="Add a comment"
        label="Comment"
        field="body"
        required="Write a comment first."

        placeholder="Add to the thread."
        submitText="Add comment"
        onSubmit={async (body, f) => {
          setProblem(null);
          try {
            await run(() => commentFlag(project.id, flag.id, { body }));
            onChanged();
            return true;
          } catch (e) {
            if (!showFieldErrors(f, e, ['body'])) setProblem(errorMessage(e));
            return false;
          }
        }}
      />
      {problem && <Alert type="error" showIcon title={problem} />}
    </Flex>
  );
}
