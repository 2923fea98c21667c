import { Tag, Tooltip, Typography } from 'antd';
import { NOT_ON_FILE_SOURCE, type Fact, type OpenQuestion } from '@amberline/common';

/** A known fact's status, citation, edition and as-of date, linked to the text it was read in. */
export function FactSource({ fact }: { fact: Fact<unknown> }) {
  if (fact.status === 'unknown') return <NotOnFile what={fact.note} />;
  return (
    <Typography.Text type="secondary" style={{ fontSize: 12 }} data-testid="rule-source">
      <a href={fact.url} target="_blank" rel="noreferrer noopener">
        {fact.citation}
      </a>{' '}
      · {fact.edition} · read {fact.asOf}
      {fact.status === 'secondary' && <SecondaryTag />}
      {(fact.quote || fact.note) && (
        <Tooltip title={[fact.quote ? `“${fact.quote}”` : '', fact.note ?? ''].filter(Boolean).join(' — ')}>
          <Typography.Text type="secondary" style={{ fontSize: 12, marginLeft: 4, cursor: 'help' }}>
            (text)
          </Typography.Text>
        </Tooltip>
      )}
    </Typography.Text>
  );
}

export function SecondaryTag() {
  return (
    <Tag color="gold" style={{ marginLeft: 6 }} data-testid="secondary-tag">
      secondary source
    </Tag>
  );
}

/** How a topic the rulebook lacks reads everywhere: a style of its own, never "none". */
export function NotOnFile({ what, children }: { what?: string; children?: React.ReactNode }) {
  return (
    <span
      data-testid="not-on-file"
      title={what}
      style={{ display: 'inline-block', border: '1px dashed #b45309', background: '#fffbeb', color: '#92400e', borderRadius: 4, padding: '0 6px', fontSize: 13 }}
    >
      {children ?? 'not on file — check the permit'}
    </span>
  );
}

/** The move's open questions: topics the rulebook has not on file, until a permit answers them. */
export function OpenQuestions({ questions }: { questions: OpenQuestion[] }) {
  if (questions.length === 0) return null;
  return (
    <div data-testid="open-questions" style={{ border: '1px dashed #b45309', background: '#fffbeb', borderRadius: 4, padding: '8px 12px', margin: '8px 0' }}>
      <Typography.Text strong style={{ color: '#92400e' }}>
        Open questions ({questions.length}) — not on file in the rulebook; the permit must answer them
      </Typography.Text>
      <ul style={{ margin: '4px 0 0', paddingLeft: 18 }}>
        {questions.map((q, i) => (
          <li key={i}>{q.message}</li>
        ))}
      </ul>
    </div>
  );
}

/** A citation string as the engine writes it, with secondary sources and topics not on file made visible. */
export function CitedSource({ text }: { text: string }) {
  if (text === NOT_ON_FILE_SOURCE) return <NotOnFile />;
  const secondary = /\(secondary source\)/.test(text);
  return (
    <Typography.Text type="secondary" style={{ fontSize: 12 }}>
      {text.replace(' (secondary source)', '')}
      {secondary && <SecondaryTag />}
    </Typography.Text>
  );
}
