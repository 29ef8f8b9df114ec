import { Body, Button, Container, Head, Hr, Html, Preview, Section, Text } from '@react-email/components';
import type { ReactNode } from 'react';
import { palette } from '@/lib/palette';

// The shell every customer e-mail shares: the shop's name at the top, its contact details at the foot.
// React escapes every value, so names and descriptions typed by people never become markup.
export type MailShop = { name: string; email: string | null; phone: string | null; address: string | null };

const body = {
  backgroundColor: palette.paper.DEFAULT,
  fontFamily: 'Helvetica, Arial, sans-serif',
  color: palette.ink.DEFAULT,
};
const card = {
  backgroundColor: palette.paper.raised,
  padding: '24px',
  maxWidth: '560px',
  margin: '0 auto',
  borderRadius: '6px',
};
const small = { fontSize: '13px', color: palette.ink.muted, margin: '2px 0' };

export function MailLayout({ shop, preview, children }: { shop: MailShop; preview: string; children: ReactNode }) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body style={body}>
        <Container style={card}>
          <Text style={{ fontSize: '14px', fontWeight: 700, margin: '0 0 12px' }}>{shop.name}</Text>
          {children}
          <Hr />
          <Section>
            <Text style={small}>{shop.name}</Text>
            {shop.address ? <Text style={small}>{shop.address}</Text> : null}
            {shop.phone ? <Text style={small}>Phone {shop.phone}</Text> : null}
            {shop.email ? <Text style={small}>Reply to this e-mail or write to {shop.email}</Text> : null}
          </Section>
        </Container>
      </Body>
    </Html>
  );
}

export const paragraph = { fontSize: '16px', lineHeight: '24px', margin: '0 0 14px' };

const button = {
  backgroundColor: palette.ember[600],
  color: palette.paper.raised,
  padding: '12px 18px',
  borderRadius: '6px',
  fontWeight: 700,
};

/** The button to the customer's private page, with the address written out for mail apps that drop buttons. */
export function PrivateLinkButton({ href, children }: { href: string; children: ReactNode }) {
  return (
    <>
      <Button href={href} style={button}>
        {children}
      </Button>
      <Text style={paragraph}>
        This link is private to you; please do not share it. If the button does not work, copy this address: {href}
      </Text>
    </>
  );
}

// E-mails format figures the way the screens do (src/lib/format.ts).
export { formatMoney as money, longDate } from '@/lib/format';
