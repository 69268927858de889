using System.Buffers.Binary;
using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

/// <summary><see cref="ShardSpec"/>: parsing K/N and the path-hash rule that decides a photo's shard.</summary>
public sealed class ShardSpecTests
{
    [Theory]
    [InlineData("1/1", 1, 1)]
    [InlineData("3/8", 3, 8)]
    [InlineData("8/8", 8, 8)]
    [InlineData("12/100", 12, 100)]
    public void Parse_reads_k_of_n(string text, int k, int n) => Assert.Equal(new ShardSpec(k, n), ShardSpec.Parse(text));

    [Theory]
    [InlineData("")]
    [InlineData("3")]
    [InlineData("0/3")]
    [InlineData("4/3")]
    [InlineData("1/0")]
    [InlineData("-1/3")]
    [InlineData("+1/3")]
    [InlineData(" 1/3")]
    [InlineData("1/3/5")]
    [InlineData("a/b")]
    public void Parse_refuses_anything_but_k_of_n_with_the_form_in_the_message(string text)
    {
        var error = Assert.Throws<FormatException>(() => ShardSpec.Parse(text));

        Assert.Contains("K/N", error.Message, StringComparison.Ordinal);
    }

    // The first 16 hex digits of each path's SHA-256 as printed by GNU coreutils
    // (printf '%s' PATH | sha256sum), so the rule is pinned to an outside implementation of SHA-256:
    // a shard must not change between runs, machines or .NET versions (a string hash code would).
    [Theory]
    [InlineData("opencv/aloeL.jpg", "e08d5c1d0425e4fa")]
    [InlineData("BRK-2210/front.jpg", "98a9c7a6fe0ef8f0")]
    [InlineData("Ünïcode/fötö.jpg", "2e593b9d8628bc55")]
    [InlineData("a", "ca978112ca1bbdca")]
    public void Of_takes_the_first_eight_bytes_of_the_paths_sha256_little_endian_modulo_n(string path, string sha256Prefix)
    {
        ulong key = BinaryPrimitives.ReadUInt64LittleEndian(Convert.FromHexString(sha256Prefix));

        foreach (int n in new[] { 1, 2, 3, 7, 8, 64, 1000 })
        {
            Assert.Equal((int)(key % (ulong)n) + 1, ShardSpec.Of(path, n));
        }
    }

    [Fact]
    public void Every_path_belongs_to_exactly_one_shard_for_every_n_and_shards_are_balanced()
    {
        var paths = Enumerable.Range(0, 5_000).Select(i => $"SKU-{i % 613:D4}/view-{i:D5}.jpg").ToList();

        for (int n = 1; n <= 12; n++)
        {
            var shards = Enumerable.Range(1, n).Select(k => new ShardSpec(k, n)).ToList();
            var sizes = new int[n];
            foreach (string path in paths)
            {
                var owners = shards.Where(s => s.Contains(path)).ToList();
                Assert.Single(owners);
                sizes[owners[0].Index - 1]++;
            }

            // 5,000 paths over n shards: a shard within ±20 % of the mean is over 4 standard deviations wide for n ≤ 12.
            double mean = paths.Count / (double)n;
            Assert.All(sizes, size => Assert.InRange(size, mean * 0.8, mean * 1.2));
        }
    }
}
