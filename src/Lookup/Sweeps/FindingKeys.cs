using System.Security.Cryptography;
using System.Text;

namespace Lookup.Sweeps;

/// <summary>
/// Stable keys: a SHA-256 over a canonical text, cut to 32 hex digits (128 bits). They rest on the files' SHA-256, not
/// on paths, so renaming or moving a file keeps a finding and a reviewer's decision; editing a photo makes new ones.
/// </summary>
public static class FindingKeys
{
    /// <summary>The key of an unordered pair of photos, from their SHA-256.</summary>
    public static string Pair(string sha256A, string sha256B)
    {
        ArgumentNullException.ThrowIfNull(sha256A);
        ArgumentNullException.ThrowIfNull(sha256B);
        var (a, b) = (sha256A.ToLowerInvariant(), sha256B.ToLowerInvariant());
        return Hash(string.CompareOrdinal(a, b) <= 0 ? $"pair\n{a}\n{b}" : $"pair\n{b}\n{a}");
    }

    /// <summary>The key of a group finding: its kind and its members' SHA-256, sorted (repeats kept).</summary>
    public static string Group(FindingKind kind, IEnumerable<string> memberSha256)
    {
        ArgumentNullException.ThrowIfNull(memberSha256);
        var sorted = memberSha256.Select(s => s.ToLowerInvariant()).Order(StringComparer.Ordinal);
        return Hash($"{kind}\n{string.Join('\n', sorted)}");
    }

    /// <summary>The key of an outlier finding: the flagged photo and the SKU it is filed under.</summary>
    public static string Outlier(string sha256, string sku)
    {
        ArgumentNullException.ThrowIfNull(sha256);
        ArgumentNullException.ThrowIfNull(sku);
        return Hash($"{FindingKind.FarFromItsSku}\n{sha256.ToLowerInvariant()}\n{sku}");
    }

    private static string Hash(string text) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text)))[..32];
}
