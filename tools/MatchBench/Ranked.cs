namespace MatchBench;

/// <summary>One ranking row as lookup match --json printed it.</summary>
internal sealed record Ranked(string Sku, float Distance, float WholePhotoDistance, float Margin, string Verdict);
