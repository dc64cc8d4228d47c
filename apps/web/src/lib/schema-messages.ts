import * as z from 'zod/mini';

// The shared schemas are written with zod/mini, which loads no messages: a check without a
// message of its own would read "Invalid input". This loads zod's English ones ("Too big: expected
// number to be <=120"), before any form validates: every form takes its resolver from here, and
// the field walkthrough imports this before it checks a reading. Not in the app's first load.
z.config(z.locales.en());

export { zodResolver } from '@hookform/resolvers/zod';
