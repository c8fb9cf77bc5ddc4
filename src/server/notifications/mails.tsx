// The notification mails: one at once per event, or one weekly digest per member. Rendered with React Email
// into an HTML part and a plain-text part; every mail carries one-click unsubscribe headers (RFC 8058).
import { Body, Container, Head, Heading, Hr, Html, Link, Preview, Section, Text } from '@react-email/components';
import { render, toPlainText } from '@react-email/render';
import { config } from '../core/config';
import type { OutgoingMail } from '../mail/send';
import { signUnsubscribe, type StopWhat } from '@/lib/notifications/unsubscribe-token';
import { kindDescriptions, type NotificationKind } from '@/lib/notifications/kinds';

export interface MailEvent {
  kind: NotificationKind;
  title: string;
  line: string;
  path: string;
}

export interface Recipient {
  id: number;
  email: string;
  name: string;
}

const colours = { paper: '#f6f1e7', ink: '#1c2726', link: '#0f4c4a', quiet: '#4d5957' };

function absolute(path: string): string {
  return new URL(path, config().PUBLIC_ORIGIN).href;
}

/** The signed address that stops this mail without signing in. */
export function unsubscribeUrl(userId: number, what: StopWhat): string {
  const secret = config().AUTH_SECRET;
  if (!secret) throw new Error('AUTH_SECRET is needed to sign unsubscribe links.');
  return absolute(`/unsubscribe/${signUnsubscribe(secret, { userId, what })}`);
}

function unsubscribeHeaders(url: string): Record<string, string> {
  return { 'List-Unsubscribe': `<${url}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
}

interface FrameProps {
  preview: string;
  greeting: string;
  children: React.ReactNode;
  stopUrl: string;
  stopLabel: string;
}

function Frame({ preview, greeting, children, stopUrl, stopLabel }: FrameProps) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body
        style={{
          margin: 0,
          padding: '24px',
          background: colours.paper,
          color: colours.ink,
          fontFamily: 'Georgia, serif',
          fontSize: '16px',
        }}
      >
        <Container style={{ maxWidth: '560px' }}>
          <Text>{greeting}</Text>
          {children}
          <Hr />
          <Text style={{ fontSize: '13px', color: colours.quiet }}>
            {stopLabel}{' '}
            <Link href={stopUrl} style={{ color: colours.link }}>
              Stop these e-mails
            </Link>
            {' · '}
            <Link href={absolute('/account/notifications')} style={{ color: colours.link }}>
              Choose what reaches you
            </Link>
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

function EventBlock({ event }: { event: MailEvent }) {
  return (
    <Section>
      <Text style={{ margin: '0 0 4px' }}>
        <Link href={absolute(event.path)} style={{ color: colours.link, fontWeight: 'bold' }}>
          {event.title}
        </Link>
      </Text>
      {event.line ? <Text style={{ margin: '0 0 16px' }}>{event.line}</Text> : null}
    </Section>
  );
}

async function asMail(to: string, subject: string, element: React.ReactElement, headers: Record<string, string>): Promise<OutgoingMail> {
  // One render: the plain-text part is derived from the HTML (links kept as "text [url]").
  const html = await render(element);
  const text = toPlainText(html);
  return { to, subject, html, text, headers };
}

/** One event, sent at once. The stop link ends what caused it: the follow, or this kind of mail. */
export async function eventMail(recipient: Recipient, event: MailEvent, stop: StopWhat): Promise<OutgoingMail> {
  const stopUrl = unsubscribeUrl(recipient.id, stop);
  const stopLabel =
    'follow' in stop ? 'You follow this on Benchlore.' : `You chose to hear at once: ${kindDescriptions[event.kind].label.toLowerCase()}.`;
  const element = (
    <Frame preview={event.line || event.title} greeting={`Hello ${recipient.name},`} stopUrl={stopUrl} stopLabel={stopLabel}>
      <Heading as="h2" style={{ fontSize: '18px' }}>
        {kindDescriptions[event.kind].label}
      </Heading>
      <EventBlock event={event} />
    </Frame>
  );
  return asMail(recipient.email, `${kindDescriptions[event.kind].label}: ${event.title}`, element, unsubscribeHeaders(stopUrl));
}

/** The weekly digest: every event of the week the member chose to hear about that way, grouped by kind. */
export async function digestMail(recipient: Recipient, events: MailEvent[], weekOf: Date): Promise<OutgoingMail> {
  const stopUrl = unsubscribeUrl(recipient.id, { digest: true });
  const week = weekOf.toISOString().slice(0, 10);
  const kinds = [...new Set(events.map((e) => e.kind))];
  const element = (
    <Frame
      preview={`${events.length} new for you on Benchlore this week`}
      greeting={`Hello ${recipient.name}, here is what happened this week for what you follow and wrote.`}
      stopUrl={stopUrl}
      stopLabel="This is your weekly digest."
    >
      {kinds.map((kind) => (
        <Section key={kind}>
          <Heading as="h2" style={{ fontSize: '18px' }}>
            {kindDescriptions[kind].label}
          </Heading>
          {events
            .filter((e) => e.kind === kind)
            .map((event, n) => (
              <EventBlock key={n} event={event} />
            ))}
        </Section>
      ))}
    </Frame>
  );
  return asMail(recipient.email, `Your Benchlore week of ${week}: ${events.length} new`, element, unsubscribeHeaders(stopUrl));
}
