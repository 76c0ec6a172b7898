namespace OmicsScreen.Engine.Trees;

/// <summary>A node waiting to be grown: its slice [Start, End) of the row array, its depth and where it hangs.</summary>
internal readonly record struct PendingNode(int Start, int End, int Depth, int Parent, bool IsLeft);
