namespace OmicsScreen.Screening.Screen;

/// <summary>What one share of a run's memory holds, so a caller can say truthfully what would shrink it.</summary>
public enum MemoryComponent
{
    /// <summary>The .NET runtime, the program's code and its libraries, before any panel is read.</summary>
    RuntimeBaseline,

    /// <summary>The panel as loaded: float32 values, cell states, names and ids; alive for the whole run.</summary>
    RawMatrix,

    /// <summary>Buffers a reader holds while it builds the matrix (gathered columns, an Arrow file's batches).</summary>
    LoaderTransient,

    /// <summary>One byte code per cell plus each feature's bin bounds, shared by every forest.</summary>
    BinnedCodes,

    /// <summary>Per-feature result rows: univariate statistics and the screen's feature summaries.</summary>
    FeatureTables,

    /// <summary>The forest on all samples, kept to the end for the shortlist's group importances.</summary>
    ReferenceForest,

    /// <summary>A repeat's two forests (importance forest and corrected-importance forest) with their out-of-bag rows.</summary>
    RepeatForests,

    /// <summary>A repeat's permuted copy of every feature and its decoys: the widened matrix of the corrected-importance forest.</summary>
    PermutedCopyAndDecoyColumns,

    /// <summary>Each thread's tree-growing buffers and the tree it is building.</summary>
    TreesInFlight,

    /// <summary>The raw repeats x features matrices (four importances and a selection flag per cell), kept whole.</summary>
    RepeatImportances,

    /// <summary>The inner screens' repeat matrices of the panel-size curve.</summary>
    PanelSizeCurve,

    /// <summary>Dead objects the collector has not yet reclaimed: the heap grows past its live size between full collections.</summary>
    CollectorHeadroom,
}
