export { signIn } from './auth.ts';
export { latestMailTo, linkIn, type CaughtMail } from './mail.ts';
export { screenshot, SCREENSHOT_DIR } from './screenshots.ts';
export { csrfHeaders, DEMO_PASSWORD, emptyBasketOf, shelvedThroughApi, signedInPage, submittedThroughApi } from './people.ts';
