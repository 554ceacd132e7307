// The one plan Outturn sells: a monthly price per paid seat (owners and estimators).
// The price lives in the payment service; its id can be set per environment.
export const SEAT_PRICE_ID = process.env.STRIPE_SEAT_PRICE_ID ?? 'price_outturn_seat_monthly';
export const PLAN_NAME = 'Seats, monthly';

/** New organisations try the product for 14 days with 3 paid seats. */
export const TRIAL_DAYS = 14;
export const TRIAL_SEATS = 3;

/** Upper bound on one order, to catch a typo such as 5000 for 50. */
export const MAX_SEATS = 500;
