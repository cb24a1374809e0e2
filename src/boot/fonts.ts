// Fonts and icons are served by the app from @quasar/extras; nothing is fetched from a CDN.
import '@quasar/extras/roboto-font/roboto-font.css';
import '@quasar/extras/material-icons/material-icons.css';
