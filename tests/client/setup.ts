// Quasar must be installed on every mounted component, or they fail with `injection "_q_" not found`.
import { config } from '@vue/test-utils';
import { Dialog, Notify, Quasar } from 'quasar';

config.global.plugins = [[Quasar, { plugins: { Notify, Dialog } }]];
