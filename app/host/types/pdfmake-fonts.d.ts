// pdfmake ships Roboto with a CommonJS file of absolute font paths (it has no type declarations).
declare module 'pdfmake/fonts/Roboto.js' {
  const fonts: { readonly Roboto: { readonly normal: string; readonly bold: string; readonly italics: string; readonly bolditalics: string } };
  export default fonts;
}

// pdfmake's word breaker (a CommonJS class on `default`), which the sheet's writer uses to cut text where pdfmake would.
declare module 'pdfmake/js/TextBreaker.js' {
  const TextBreaker: unknown;
  export default TextBreaker;
}
