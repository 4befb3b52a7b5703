// jstat ships without type declarations; the tests use it only as a reference library.
declare module 'jstat';
