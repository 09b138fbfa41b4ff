import { expect, expectAccessible, test } from './fixtures';
import { PartsPage } from './pages/cut-plan-page';
import { StockRackPage } from './pages/stock-rack-page';

const EPISODE = 'One Stool, Three Ways';
const STARTER = 'Starter: pocket-screwed pine stool';

test('a board on hand is pulled instead of bought, marking the cuts done puts the offcut on hand, and taking them back undoes it', async ({ signedIn }, testInfo) => {
  test.setTimeout(180_000);
  const species = `Hemlock ${Date.now().toString(36)}`;
  const stockName = `2x4 ${species}`;
  const page = await signedIn('shopHand');
  const rack = new StockRackPage(page);
  await rack.goto();
  await rack.addSoftwood({ species, profile: '2x4', sizes: '10ft 6.20' });
  await expect(rack.item(stockName)).toBeVisible();

  // Three 30" rails: one 10 ft board to buy while nothing is on hand.
  const parts = new PartsPage(page);
  await parts.open(EPISODE, STARTER);
  await parts.addPart({ name: `Rail ${species}`, quantity: '3', length: '30', stock: stockName });
  await expect(parts.stockGroup(stockName).getByRole('row', { name: /120" 1 \$6\.20 \$6\.20/ })).toBeVisible();

  // A 9 ft board already in the shop, added by hand with the rack's length notation.
  await rack.goto();
  await rack.addOnHand({ stock: stockName, length: "9'", count: '1' });
  await expect(rack.onHandPiece(`1 × ${stockName}, 108"`)).toBeVisible();
  await expect(rack.onHandPiece(`1 × ${stockName}, 108"`).getByText('Added by hand')).toBeVisible();
  await expectAccessible(page);
  await rack.onHand().scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('on-hand-1280.png'), fullPage: false });

  await parts.open(EPISODE, STARTER);
  const plan = await parts.openEpisodePlan();
  const group = plan.stockGroup(stockName);
  // The plan pulls the 9 ft board from the rack and buys nothing of this stock.
  await expect(group.getByRole('table', { name: `Pull from rack: ${stockName}` }).getByRole('row', { name: /108" 1 \$0\.00/ })).toBeVisible();
  await expect(group.getByText('Nothing to buy: every board comes from the rack.')).toBeVisible();
  await expect(group.getByRole('img', { name: /Board 1 \(from the rack\): 108"/ })).toBeVisible();
  await expectAccessible(page);
  await group.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('pull-from-rack-1280.png') });

  await plan.markCutsDone(stockName);
  // 108" less three 30" rails and their kerfs leaves 17 5/8", longer than the 12" worth keeping.
  await expect(page.getByRole('status').filter({ hasText: 'Cuts recorded. 1 offcut is now on hand.' })).toBeVisible();
  await expect(page.getByRole('region', { name: 'Cuts done' }).getByText(stockName)).toBeVisible();
  await expect(plan.stockGroup(stockName)).toHaveCount(0);
  await expectAccessible(page);

  await rack.goto();
  await expect(rack.onHandPiece(`${stockName}, 108"`)).toHaveCount(0);
  const kept = rack.onHandPiece(`1 × ${stockName}, 17 5/8"`);
  await expect(kept).toBeVisible();
  await expect(kept.getByText(`from ${EPISODE}`)).toBeVisible();
  await expectAccessible(page);
  await page.setViewportSize({ width: 375, height: 900 });
  await kept.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('on-hand-375.png') });
  // On a phone the section fits the screen: nothing runs off to the side.
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);

  // An editor reads the cuts done but cannot take them back (nor mark them).
  const editorPage = await signedIn('editor');
  const editorParts = new PartsPage(editorPage);
  await editorParts.open(EPISODE, STARTER);
  const editorPlan = await editorParts.openEpisodePlan();
  await expect(editorPlan.cutsDone().getByText(stockName)).toBeVisible();
  await expect(editorPlan.cutsDone().getByText(/3 pieces from 1 board: 1 pulled from the rack/)).toBeVisible();
  await expect(editorPlan.cutsDone().getByRole('button', { name: /Take back/ })).toHaveCount(0);
  await expectAccessible(editorPage);

  // Marked done by mistake: take it back. While the offcut it kept is not on hand as kept, it is refused,
  // the refusal takes the focus, and nothing changes.
  await page.setViewportSize({ width: 1280, height: 900 });
  await rack.goto();
  await rack.setOnHandCount(stockName, '17 5/8"', '2');
  await parts.open(EPISODE, STARTER);
  const refused = await parts.openEpisodePlan();
  await refused.askTakeBack(stockName);
  expect(await refused.confirmTakeBack(stockName)).toBe(409);
  const refusal = refused.cutsDone().getByRole('alert');
  await expect(refusal).toHaveText(`These cuts of ${stockName} cannot be taken back: the 17 5/8" offcut they kept was changed on hand: 1 kept, 2 on hand now. Nothing was changed.`);
  await expect(refusal).toBeFocused();
  await expect(refused.cutsDone().getByText(stockName, { exact: true })).toBeVisible();
  await expectAccessible(page);
  await rack.goto();
  await rack.setOnHandCount(stockName, '17 5/8"', '1');

  // With the offcut as kept, the confirmation says what will happen, in numbers.
  await parts.open(EPISODE, STARTER);
  const again = await parts.openEpisodePlan();
  // By keyboard: Enter opens the question with focus on Cancel; Cancel gives focus back to the button.
  const takeBackButton = again.cutsDone().getByRole('button', { name: `Take back the cuts of ${stockName}` });
  await takeBackButton.focus();
  await page.keyboard.press('Enter');
  await expect(again.cutsDone().getByRole('button', { name: 'Cancel' })).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(takeBackButton).toBeFocused();
  const confirm = await again.askTakeBack(stockName);
  await expect(confirm).toContainText(
    `Take back these cuts of ${stockName}? This puts 1 board back on the rack, removes the 1 offcut it kept from what is on hand and unticks 3 pieces on the cut list.`,
  );
  await expectAccessible(page);
  await confirm.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('take-back-1280.png') });
  await page.setViewportSize({ width: 375, height: 900 });
  await confirm.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('take-back-375.png') });
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
  expect(await again.confirmTakeBack(stockName)).toBe(200);
  const result = again.cutsDone().getByRole('status');
  await expect(result).toHaveText('Cuts taken back: 1 board is back on the rack, 1 kept offcut removed, 3 pieces unticked.');
  await expect(result).toBeFocused();
  await expect(again.cutsDone().getByText(stockName)).toHaveCount(0);
  // The plan pulls the 9 ft board again, and its cuts can be marked done again.
  await expect(again.stockGroup(stockName).getByRole('table', { name: `Pull from rack: ${stockName}` }).getByRole('row', { name: /108" 1 \$0\.00/ })).toBeVisible();
  await expectAccessible(page);
  await again.cutsDone().scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('taken-back-375.png') });

  // The board is on hand again, the offcut it kept is gone.
  await rack.goto();
  await expect(rack.onHandPiece(`1 × ${stockName}, 108"`)).toBeVisible();
  await expect(rack.onHandPiece(`1 × ${stockName}, 108"`).getByText('Added by hand')).toBeVisible();
  await expect(rack.onHandPiece(`${stockName}, 17 5/8"`)).toHaveCount(0);
  await expectAccessible(page);
});

test('an editor sees what is on hand but cannot change it', async ({ signedIn }) => {
  const page = await signedIn('editor');
  const rack = new StockRackPage(page);
  await rack.goto();
  await expect(rack.onHand()).toBeVisible();
  await expect(rack.onHandPiece(/2x4 SPF, 60"/)).toBeVisible();
  await expect(rack.onHand().getByRole('button')).toHaveCount(0);
  await expect(page.getByRole('form', { name: 'Add a piece on hand' })).toHaveCount(0);
  await expectAccessible(page);
});
