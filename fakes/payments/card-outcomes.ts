// Test cards and server-side test payment methods, with the outcome the hosted test mode gives them.
// Source: the public testing docs' "declined payments" table (as mirrored in public READMEs; messages from
// memory). Decline codes exist only for `card_declined`; the other codes carry none.

export type CardOutcome =
  | { ok: true }
  | { ok: false; code: string; decline_code?: string; message: string };

const SUCCEEDS: CardOutcome = { ok: true };

function declined(declineCode: string, message = 'Your card was declined.'): CardOutcome {
  return { ok: false, code: 'card_declined', decline_code: declineCode, message };
}

const EXPIRED: CardOutcome = { ok: false, code: 'expired_card', message: 'Your card has expired.' };
const INCORRECT_CVC: CardOutcome = { ok: false, code: 'incorrect_cvc', message: "Your card's security code is incorrect." };
const PROCESSING_ERROR: CardOutcome = {
  ok: false,
  code: 'processing_error',
  message: 'An error occurred while processing your card. Try again in a little bit.',
};
export const INCORRECT_NUMBER: CardOutcome = { ok: false, code: 'incorrect_number', message: 'Your card number is incorrect.' };

/** Card numbers typed on the hosted page (digits only). Any other number is "incorrect_number". */
export const TEST_CARD_NUMBERS: Readonly<Record<string, CardOutcome>> = {
  '4242424242424242': SUCCEEDS,
  // Succeeds with funds available at once; in this fake every success behaves like that.
  '4000000000000077': SUCCEEDS,
  '4000000000000002': declined('generic_decline'),
  '4000000000009995': declined('insufficient_funds', 'Your card has insufficient funds.'),
  '4000000000009987': declined('lost_card'),
  '4000000000009979': declined('stolen_card'),
  '4000000000000069': EXPIRED,
  '4000000000000127': INCORRECT_CVC,
  '4000000000000119': PROCESSING_ERROR,
};

/** Server-side test payment methods accepted as `payment_method` on PaymentIntents. */
export const TEST_PAYMENT_METHODS: Readonly<Record<string, { outcome: CardOutcome; last4: string }>> = {
  pm_card_visa: { outcome: SUCCEEDS, last4: '4242' },
  pm_card_visa_debit: { outcome: SUCCEEDS, last4: '5556' },
  pm_card_mastercard: { outcome: SUCCEEDS, last4: '4444' },
  pm_card_bypassPending: { outcome: SUCCEEDS, last4: '0077' },
  pm_card_visa_chargeDeclined: { outcome: declined('generic_decline'), last4: '0002' },
  pm_card_visa_chargeDeclinedInsufficientFunds: { outcome: declined('insufficient_funds', 'Your card has insufficient funds.'), last4: '9995' },
  pm_card_visa_chargeDeclinedLostCard: { outcome: declined('lost_card'), last4: '9987' },
  pm_card_visa_chargeDeclinedStolenCard: { outcome: declined('stolen_card'), last4: '9979' },
  pm_card_chargeDeclinedExpiredCard: { outcome: EXPIRED, last4: '0069' },
  pm_card_chargeDeclinedIncorrectCvc: { outcome: INCORRECT_CVC, last4: '0127' },
  pm_card_chargeDeclinedProcessingError: { outcome: PROCESSING_ERROR, last4: '0119' },
};

/** Digits of a typed card number: spaces and dashes are how people type them. */
export function normaliseCardNumber(typed: string): string {
  return typed.replace(/[\s-]/g, '');
}

export function outcomeForCardNumber(typed: string): CardOutcome {
  return TEST_CARD_NUMBERS[normaliseCardNumber(typed)] ?? INCORRECT_NUMBER;
}
