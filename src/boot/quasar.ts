// Quasar's options for the app: the plugins the screens use and their defaults.
// Components are imported per file by the Vite plugin, so only plugins are named here.
import { Dialog, Notify, type QuasarPluginOptions } from 'quasar';

export const quasarOptions: Partial<QuasarPluginOptions> = {
  plugins: { Notify, Dialog },
  config: {
    notify: { position: 'top-right', timeout: 4000 },
  },
};
