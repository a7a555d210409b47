import Head from 'expo-router/head';

/** The browser tab's title for the screen shown: what it is first, then the product, so a row of tabs stays readable. */
export function PageTitle({ title }: { title: string }) {
  return (
    <Head>
      <title>{`${title} · Matwright`}</title>
    </Head>
  );
}
