// Quasar's options for the app: the plugins the screens use and their defaults.
// Components are imported per file by the Vite plugin, so only plugins are named here.
import { Dialog, Loading, Notify, type QuasarPluginOptions } from 'quasar';

export const quasarOptions: Partial<QuasarPluginOptions> = {
  plugins: { Notify, Dialog, Loading },
  config: {
    notify: { position: 'top-right', timeout: 4000 },
    loading: { delay: 300 },
  },
};
