import { DEMO_SLUG, PHONE, demo, expect, expectAccessible, sameOrigin, newEpisode, test, waitForMail } from './fixtures';
import { RunningOrderPage } from './pages/running-order-page';
import { SegmentPage } from './pages/segment-page';
import { ShopBoardPage } from './pages/shop-board-page';

test('host pastes and assigns shots, the shop hand gets one e-mail and works them on a phone, the host sees progress', async ({ signedIn }) => {
  const stamp = Date.now().toString(36);
  const lines = [`CU: glue squeeze-out ${stamp}`, `Wide / B cam: clamp the base ${stamp}`, `Overhead: dry fit ${stamp}`];

  const host = await signedIn('host', { viewport: { width: 1280, height: 1000 } });
  const { episodeId, segmentUrl } = await newEpisode(host, `Shop stool shots ${stamp}`);

  const segment = new SegmentPage(host);
  await segment.goto(segmentUrl);
  await segment.pasteShots(lines, demo.shopHand.name);
  const list = segment.shotList();
  await expect(list.getByText(`glue squeeze-out ${stamp}`)).toBeVisible();
  await expect(list.getByText(`clamp the base ${stamp}`)).toBeVisible();
  await expectAccessible(host);

  await new ShopBoardPage(host).goto(episodeId);
  await host.getByRole('button', { name: /Send to crew/ }).click();
  await expect(host.getByRole('status').filter({ hasText: /Sent/ })).toBeVisible();

  const [mail] = await waitForMail(demo.shopHand.email, { needle: `glue squeeze-out ${stamp}` });
  if (!mail) throw new Error('no mail');
  expect(mail.text).toContain(`clamp the base ${stamp} (Wide, B cam)`);
  expect(mail.text).toContain('Shop stool shots');
  // The burst lists every shot assigned to the shop hand and not yet sent, other tests' too: take this shot's link.
  const link = /(http\S+#shot-[0-9a-f-]+)/.exec(mail.text.slice(mail.text.indexOf(`glue squeeze-out ${stamp}`)))?.[1];
  expect(link).toBeTruthy();

  const phone = await signedIn('shopHand', PHONE);
  const board = new ShopBoardPage(phone);
  await phone.goto(new URL(link!).pathname);
  await expect(phone.getByText(`glue squeeze-out ${stamp}`).first()).toBeVisible();
  await board.goto(episodeId);
  await board.markCaptured(`glue squeeze-out ${stamp}`).click();
  await board.markRetake(`dry fit ${stamp}`).click();
  const dialog = phone.getByRole('dialog');
  await dialog.getByLabel('Why a retake?').fill('Top light flared on the glue');
  await dialog.getByRole('button', { name: 'Mark Retake' }).click();
  await expect(dialog).toBeHidden();
  await expectAccessible(phone);
  await phone.reload();
  await expect(board.phoneList().getByText('Top light flared on the glue')).toBeVisible();
  await expect(board.markCaptured(`glue squeeze-out ${stamp}`)).toHaveAttribute('aria-pressed', 'true');

  const runningOrder = new RunningOrderPage(host);
  await runningOrder.goto(episodeId);
  const card = runningOrder.card('Starter build');
  await expect(card).toContainText('1 of 3 captured');
  await expect(card).toContainText('1 retake');
});

test('a host moves a card from Planned to Captured with the keyboard', async ({ signedIn }) => {
  const page = await signedIn('host', { viewport: { width: 1280, height: 1000 } });
  const stamp = Date.now().toString(36);
  const { episodeId, build } = await newEpisode(page, `Keyboard board ${stamp}`);
  const add = await page.request.post(`/api/channels/${DEMO_SLUG}/segments/${build.id}/shots/bulk`, { headers: sameOrigin, data: { text: `Wide: plane the seat ${stamp}` } });
  expect(add.status()).toBe(201);

  const board = new ShopBoardPage(page);
  await board.goto(episodeId);
  await expect(board.column('Planned').getByText(`plane the seat ${stamp}`)).toBeVisible();
  await expectAccessible(page);
  expect(await board.moveRightWithKeyboard(`plane the seat ${stamp}`, 'Captured')).toBe(200);
  await expect(board.column('Captured').getByText(`plane the seat ${stamp}`)).toBeVisible();
  await page.reload();
  await expect(board.column('Captured').getByText(`plane the seat ${stamp}`)).toBeVisible();
});
