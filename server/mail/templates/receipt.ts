import { formatAmount } from '../../../shared/billing/pricing';
import { escapeHtml, htmlFrame, type RenderedMail } from './layout';

/** The receipt after a paid order: number, date, seats, unit price, total and the card's last four digits. */
export function receiptMail({
  name,
  shopName,
  orderNumber,
  paidAt,
  quantity,
  unitAmount,
  totalAmount,
  currency,
  cardLast4,
  link,
}: {
  name: string;
  shopName: string;
  orderNumber: string;
  paidAt: Date;
  quantity: number;
  unitAmount: number;
  totalAmount: number;
  currency: string;
  cardLast4: string | null;
  link: string;
}): RenderedMail {
  const subject = `Receipt for order ${orderNumber}: ${quantity === 1 ? '1 seat' : `${quantity} seats`} on Flowlore`;
  const lines = [
    `Order: ${orderNumber}`,
    `Date: ${paidAt.toISOString().slice(0, 10)}`,
    `For: ${shopName}`,
    `Seats: ${quantity} × ${formatAmount(unitAmount, currency)}`,
    `Total paid: ${formatAmount(totalAmount, currency)}`,
    `Card: ${cardLast4 ? `ending in ${cardLast4}` : 'as given on the payment page'}`,
  ];
  const text = [`Hello ${name},`, '', 'Thank you: your payment went through and the seats are yours.', '', ...lines, '', `Your seats and orders: ${link}`].join('\n');
  const html = htmlFrame(subject, [
    `Hello ${escapeHtml(name)},`,
    'Thank you: your payment went through and the seats are yours.',
    lines.map((l) => escapeHtml(l)).join('<br>'),
  ], { href: link, label: 'See your seats and orders' });
  return { template: 'receipt', subject, text, html };
}
