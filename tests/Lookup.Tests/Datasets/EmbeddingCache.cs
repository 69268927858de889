using System.IO.Compression;

namespace Lookup.Tests.Datasets;

/// <summary>
/// Float matrices saved with a small header (rows, columns): raw float32 for the bench's local cache, and gzip
/// float16 for the embeddings committed beside the reference images (half the size; unit vectors lose ~1e-3).
/// </summary>
internal static class EmbeddingCache
{
    public static void SaveHalf(string path, float[][] rows)
    {
        using var writer = new BinaryWriter(new GZipStream(File.Create(path), CompressionLevel.SmallestSize));
        writer.Write(rows.Length);
        writer.Write(rows.Length == 0 ? 0 : rows[0].Length);
        foreach (var row in rows)
        {
            foreach (float value in row)
            {
                writer.Write((Half)value);
            }
        }
    }

    public static float[][] LoadHalf(string path)
    {
        using var reader = new BinaryReader(new GZipStream(File.OpenRead(path), CompressionMode.Decompress));
        int count = reader.ReadInt32();
        int dimension = reader.ReadInt32();
        var rows = new float[count][];
        for (int i = 0; i < count; i++)
        {
            rows[i] = new float[dimension];
            for (int j = 0; j < dimension; j++)
            {
                rows[i][j] = (float)reader.ReadHalf();
            }
        }

        return rows;
    }

    public static void Save(string path, float[][] rows)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(path))!);
        using var writer = new BinaryWriter(File.Create(path));
        writer.Write(rows.Length);
        writer.Write(rows.Length == 0 ? 0 : rows[0].Length);
        foreach (var row in rows)
        {
            writer.Write(System.Runtime.InteropServices.MemoryMarshal.AsBytes(row.AsSpan()));
        }
    }

    public static float[][]? TryLoad(string path)
    {
        if (!File.Exists(path))
        {
            return null;
        }

        using var reader = new BinaryReader(File.OpenRead(path));
        int count = reader.ReadInt32();
        int dimension = reader.ReadInt32();
        var rows = new float[count][];
        for (int i = 0; i < count; i++)
        {
            rows[i] = new float[dimension];
            reader.BaseStream.ReadExactly(System.Runtime.InteropServices.MemoryMarshal.AsBytes(rows[i].AsSpan()));
        }

        return rows;
    }
}
