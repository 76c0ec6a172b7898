using OmicsScreen.Engine.Binning;

namespace OmicsScreen.Engine.Forests;

/// <summary>A forest with the binned panel it was grown on, its out-of-bag votes and its summary.</summary>
public sealed record GrownForest(BinnedMatrix Matrix, Forest Forest, OutOfBagVotes OutOfBag,
    ImpurityImportance Importance, ForestResult Result);
