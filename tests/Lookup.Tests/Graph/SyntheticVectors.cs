namespace Lookup.Tests.Graph;

/// <summary>Reproducible Gaussian test vectors: cluster centres plus isotropic noise (invented data, fixed seeds).</summary>
internal static class SyntheticVectors
{
    /// <summary><paramref name="count"/> vectors around <paramref name="clusters"/> random centres, noise σ = <paramref name="spread"/> per component.</summary>
    public static float[][] Clustered(int count, int dimension, int clusters, double spread, int seed)
    {
        var random = new Random(seed);
        var centres = new float[clusters][];
        for (int c = 0; c < clusters; c++)
        {
            centres[c] = Gaussian(random, dimension, 1.0);
        }

        var vectors = new float[count][];
        for (int i = 0; i < count; i++)
        {
            var centre = centres[random.Next(clusters)];
            var v = Gaussian(random, dimension, spread);
            for (int j = 0; j < dimension; j++)
            {
                v[j] += centre[j];
            }

            vectors[i] = v;
        }

        return vectors;
    }

    /// <summary>One vector of independent N(0, σ²) components (Box–Muller).</summary>
    public static float[] Gaussian(Random random, int dimension, double sigma)
    {
        var v = new float[dimension];
        for (int j = 0; j < dimension; j++)
        {
            double u1 = 1.0 - random.NextDouble();
            double u2 = random.NextDouble();
            v[j] = (float)(sigma * Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2));
        }

        return v;
    }

    /// <summary>Cosine distance in double precision, computed from scratch (no shared code with the engine).</summary>
    public static double ReferenceDistance(float[] a, float[] b)
    {
        double dot = 0, na = 0, nb = 0;
        for (int i = 0; i < a.Length; i++)
        {
            dot += (double)a[i] * b[i];
            na += (double)a[i] * a[i];
            nb += (double)b[i] * b[i];
        }

        return 1.0 - (dot / Math.Sqrt(na * nb));
    }
}
