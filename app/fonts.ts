import localFont from 'next/font/local';

// Shipped from the npm font package: nothing is downloaded at build or run time.
export const inter = localFont({
  src: '../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2',
  variable: '--font-inter',
  weight: '100 900',
  display: 'swap',
});
