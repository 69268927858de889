using System.Globalization;
using System.Numerics.Tensors;

namespace Lookup.Tests.Embedding;

/// <summary>Brute-force nearest neighbours by cosine distance (1 − dot on unit vectors): the oracle for the checks.</summary>
internal static class ExactSearch
{
    public static double CosineDistance(float[] a, float[] b) => 1.0 - TensorPrimitives.Dot(a, b);

    /// <summary>Gallery entries ordered by distance to <paramref name="query"/>, leaving out <paramref name="exclude"/>.</summary>
    public static IReadOnlyList<(string Name, double Distance)> Ranking(float[] query, IReadOnlyDictionary<string, float[]> gallery, string? exclude = null) =>
        [.. gallery.Where(g => g.Key != exclude).Select(g => (g.Key, CosineDistance(query, g.Value))).OrderBy(r => r.Item2)];

    public static string Describe(IReadOnlyList<(string Name, double Distance)> ranking, int count = 4) =>
        string.Join(", ", ranking.Take(count).Select(r => string.Create(CultureInfo.InvariantCulture, $"{r.Name} {r.Distance:0.0000}")));
}
