// dxf-writer numbers every table entry and entity from this process-wide counter.
declare module 'dxf-writer/src/Handle' {
  const Handle: { seed: number };
  export default Handle;
}
