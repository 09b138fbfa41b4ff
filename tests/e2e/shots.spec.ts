import { demo, DEMO_SLUG, expect, expectAccessible, newEpisode, sameOrigin, signIn, test } from './fixtures';

type CaughtMail = { subject: string; text: string; to: { address: string }[] };

async function mailContaining(address: string, needle: string): Promise<CaughtMail> {
  const url = `${process.env.MAILDEV_WEB_URL ?? 'http://127.0.0.1:1081'}/api/email`;
  let found: CaughtMail[] = [];
  await expect
    .poll(
      async () => {
        const all = (await (await fetch(url)).json()) as CaughtMail[];
        found = all.filter((m) => m.to.some((t) => t.address === address) && m.text.includes(needle));
        return found.length;
      },
      { timeout: 20_000 },
    )
    .toBeGreaterThan(0);
  return found[0]!;
}

test('host pastes and assigns shots, the shop hand gets one e-mail and works them on a phone, the host sees progress', async ({ browser }) => {
  const stamp = Date.now().toString(36);
  const lines = [`CU: glue squeeze-out ${stamp}`, `Wide / B cam: clamp the base ${stamp}`, `Overhead: dry fit ${stamp}`];

  const hostContext = await browser.newContext({ viewport: { width: 1280, height: 1000 } });
  const host = await hostContext.newPage();
  await signIn(host, demo.host);
  const { episodeId, segmentUrl } = await newEpisode(host, `Shop stool shots ${stamp}`);

  await host.goto(segmentUrl);
  await host.getByLabel('Paste shots, one per line').fill(lines.join('\n'));
  await expect(host.getByText('3 shots will be added')).toBeVisible();
  await host.getByLabel('Assign to').selectOption({ label: 'Dev Okafor' });
  await host.getByRole('button', { name: 'Add shots' }).click();
  const list = host.getByRole('table', { name: 'Shot list' });
  await expect(list.getByText(`glue squeeze-out ${stamp}`)).toBeVisible();
  await expect(list.getByText(`clamp the base ${stamp}`)).toBeVisible();
  await expectAccessible(host);

  await host.goto(`/c/${DEMO_SLUG}/shots?episodeId=${episodeId}`);
  await host.getByRole('button', { name: /Send to crew/ }).click();
  await expect(host.getByRole('status').filter({ hasText: /Sent/ })).toBeVisible();

  const mail = await mailContaining(demo.shopHand.email, `glue squeeze-out ${stamp}`);
  expect(mail.text).toContain(`clamp the base ${stamp} (Wide, B cam)`);
  expect(mail.text).toContain('Shop stool shots');
  const link = /(http\S+#shot-[0-9a-f-]+)/.exec(mail.text)?.[1];
  expect(link).toBeTruthy();

  const phoneContext = await browser.newContext({ viewport: { width: 375, height: 800 }, hasTouch: true, isMobile: true });
  const phone = await phoneContext.newPage();
  await signIn(phone, demo.shopHand);
  await phone.goto(new URL(link!).pathname);
  await expect(phone.getByText(`glue squeeze-out ${stamp}`).first()).toBeVisible();
  await phone.goto(`/c/${DEMO_SLUG}/shots?episodeId=${episodeId}`);
  await phone.getByRole('button', { name: `Mark captured: glue squeeze-out ${stamp}` }).click();
  await phone.getByRole('button', { name: `Mark retake: dry fit ${stamp}` }).click();
  const dialog = phone.getByRole('dialog');
  await dialog.getByLabel('Why a retake?').fill('Top light flared on the glue');
  await dialog.getByRole('button', { name: 'Mark Retake' }).click();
  await expect(dialog).toBeHidden();
  await expectAccessible(phone);
  await phone.reload();
  await expect(phone.getByRole('region', { name: 'Shots in board order' }).getByText('Top light flared on the glue')).toBeVisible();
  await expect(phone.getByRole('button', { name: `Mark captured: glue squeeze-out ${stamp}` })).toHaveAttribute('aria-pressed', 'true');

  await host.goto(`/c/${DEMO_SLUG}/episodes/${episodeId}`);
  const card = host.locator('article[aria-label="Starter build"]');
  await expect(card).toContainText('1 of 3 captured');
  await expect(card).toContainText('1 retake');
  await hostContext.close();
  await phoneContext.close();
});

test('a host moves a card from Planned to Captured with the keyboard', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 1000 });
  await signIn(page, demo.host);
  const stamp = Date.now().toString(36);
  const { episodeId, build } = await newEpisode(page, `Keyboard board ${stamp}`);
  const add = await page.request.post(`/api/channels/${DEMO_SLUG}/segments/${build.id}/shots/bulk`, { headers: sameOrigin, data: { text: `Wide: plane the seat ${stamp}` } });
  expect(add.status()).toBe(201);

  await page.goto(`/c/${DEMO_SLUG}/shots?episodeId=${episodeId}`);
  const planned = page.getByRole('region', { name: 'Planned' });
  const captured = page.getByRole('region', { name: 'Captured' });
  await expect(planned.getByText(`plane the seat ${stamp}`)).toBeVisible();
  await expectAccessible(page);
  const handle = page.getByRole('button', { name: `Move: plane the seat ${stamp}` });
  await handle.focus();
  await page.keyboard.press('Space');
  await page.waitForTimeout(250);
  await page.keyboard.press('ArrowRight');
  await page.waitForTimeout(250);
  const saved = page.waitForResponse((r) => r.url().includes('/state') && r.request().method() === 'PUT');
  await page.keyboard.press('Space');
  expect((await saved).status()).toBe(200);
  await expect(captured.getByText(`plane the seat ${stamp}`)).toBeVisible();
  await page.reload();
  await expect(page.getByRole('region', { name: 'Captured' }).getByText(`plane the seat ${stamp}`)).toBeVisible();
});
