import { DEMO_SLUG, expect, expectAccessible, test } from './fixtures';
import { PartsPage } from './pages/cut-plan-page';
import { StockRackPage } from './pages/stock-rack-page';

const EPISODE = 'One Stool, Three Ways';
const STARTER = 'Starter: pocket-screwed pine stool';

test('a hardwood item in two widths: the plan buys the wider board when it is cheaper per part (issue 16)', async ({ signedIn }, testInfo) => {
  test.setTimeout(180_000);
  const species = `Cherry ${Date.now().toString(36)}`;
  const stockName = `4/4 ${species}, 4" to 7 1/4" wide`;
  const page = await signedIn('shopHand', { viewport: { width: 1280, height: 900 } });
  await page.goto(`/c/${DEMO_SLUG}`);

  const rack = new StockRackPage(page);
  await rack.openFromNav();
  // A length alone with no width before it is refused with the example to follow.
  await rack.addHardwood({ species, quarters: '4/4', pricePerBoardFoot: '10.00', sizes: "8'" });
  await expect(page.getByText(`write the board as width x length, like 6" x 8'`)).toBeVisible();
  await rack.addHardwood({ species, quarters: '4/4', pricePerBoardFoot: '10.00', sizes: `4" x 8'\n7 1/4" x 8'` });
  await expect(rack.item(stockName)).toBeVisible();
  await expect(page.getByText(`4" × 8' · 7 1/4" × 8'`)).toBeVisible();
  await expectAccessible(page);

  const parts = new PartsPage(page);
  await parts.open(EPISODE, STARTER);
  await parts.addPart({ name: `Slat ${species}`, quantity: '6', length: '40', width: '2', stock: stockName });
  await expect(parts.part(`Slat ${species}`)).toBeVisible();
  // Source: USDA FPL Wood Handbook, 144 in³ a board foot, at $10.00: a 4" x 8' board (2.67 bd ft, $26.67) takes one
  // 2" strip of two slats once the rip and jointing are allowed for, so three cost $80.01; one 7 1/4" x 8'
  // (4.83 bd ft, $48.33) takes three strips, six slats.
  const group = parts.stockGroup(stockName);
  await expect(group.getByRole('row', { name: /7 1\/4" × 8' — 4\.83 bd ft 1 \$48\.33 \$48\.33/ })).toBeVisible();
  await expect(group.getByRole('row', { name: /^4" × 8'/ })).toHaveCount(0);
  await expect(group.getByRole('img', { name: `Board 1: 7 1/4" × 8'` })).toBeVisible();
  await expect(group.getByText('Rip to 2", then crosscut')).toHaveCount(3);
  // Each strip holds two 40" slats (80 1/8" with the kerfs): the board is crosscut there first, and the
  // 96 - 80 1/4 = 15 3/4" left at full width is over the 12" minimum offcut, so it is kept.
  await expect(group.getByText('First crosscut at 80 1/8"; the rest is the offcut (keep). Then:')).toBeVisible();
  await expect(group.getByText(`Board 1: 7 1/4" × 8' · offcut 15 3/4" (keep)`)).toBeVisible();
  await expectAccessible(page);
  await group.scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('hardwood-widths-1280.png') });

  const plan = await parts.openEpisodePlan();
  const bought = `1 × ${stockName}, 7 1/4" × 8'`;
  await plan.markBought(stockName, `1 of ${bought}`);
  await expect(plan.boughtBox(stockName, `1 of ${bought}`)).toBeChecked();
  await expectAccessible(page);
  await page.setViewportSize({ width: 375, height: 900 });
  await plan.stockGroup(stockName).scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('hardwood-widths-375.png') });
  await rack.goto();
  await rack.addForm().getByLabel('Kind').selectOption({ label: 'Hardwood boards' });
  await rack.addForm().scrollIntoViewIfNeeded();
  await page.screenshot({ path: testInfo.outputPath('hardwood-rack-form-375.png') });
});
