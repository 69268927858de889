using System.Diagnostics;
using System.Security.Cryptography;
using System.Text;
using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class ContentHashTests : IDisposable
{
    private readonly TempTree _tree = new();

    public void Dispose() => _tree.Dispose();

    [Fact]
    public void Sha256Hex_gives_the_published_digest_of_abc()
    {
        // FIPS 180-2, appendix B.1: SHA-256("abc").
        using var stream = new MemoryStream(Encoding.ASCII.GetBytes("abc"));

        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", ContentHash.Sha256Hex(stream));
    }

    [Fact]
    public void Sha256Hex_of_an_empty_file_is_the_digest_of_no_bytes()
    {
        var path = _tree.File("empty.bin", []);

        // SHA-256 of the empty message, from memory; the cross-check below is with .NET's one-shot SHA256.
        Assert.Equal("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855", ContentHash.Sha256Hex(path));
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Array.Empty<byte>())), ContentHash.Sha256Hex(path));
    }

    [Fact]
    public void Sha256Hex_of_a_file_spanning_many_buffers_matches_coreutils_sha256sum()
    {
        var bytes = new byte[(1 << 20) + 17];
        new Random(20240517).NextBytes(bytes);
        var path = _tree.File("big.bin", bytes);

        var ours = ContentHash.Sha256Hex(path);

        // Two independent references: .NET's one-shot SHA256 and GNU coreutils sha256sum.
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), ours);
        Assert.Equal(CoreutilsSha256(path), ours);
    }

    private static string CoreutilsSha256(string path)
    {
        var start = new ProcessStartInfo("sha256sum", [path]) { RedirectStandardOutput = true };
        using var process = Process.Start(start)!;
        var output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        Assert.Equal(0, process.ExitCode);
        return output[..64];
    }
}
