/**
 * The label renderer: templates, font metrics, legibility, dates and barcodes, and the pdfmake
 * document of a run. A second entry of @crumbproof/shared (it needs bwip-js and fontkit), which
 * the web app loads only on its Labels page.
 */
export * from './template';
export * from './fonts';
export * from './legibility';
export * from './dates';
export * from './barcodes';
export * from './render';
