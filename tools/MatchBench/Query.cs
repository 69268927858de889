namespace MatchBench;

/// <summary>One measured query: the file, the SKU it shows (null when not stocked), its set and its fusion group.</summary>
internal sealed record Query(string File, string? Truth, string Set, string? Group);
