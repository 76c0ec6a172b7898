namespace OmicsScreen.Screening.Screen;

/// <summary>
/// The panel an outer fold's procedure locked (its inner screen's list cut by the lock rule;
/// empty when the fold locked nothing) and that panel's score on the fold's test rows (chance
/// for an empty panel): what the added value over covariates is measured against.
/// </summary>
internal sealed record FoldPanel(int[] Features, PanelScore Locked);
