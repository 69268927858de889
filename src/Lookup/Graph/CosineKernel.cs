using System.Diagnostics;
using System.Numerics.Tensors;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Lookup.Graph;

/// <summary>
/// The one SIMD kernel every distance goes through: a dot product of two equal-length spans. Vectors are
/// normalised once when stored, so cosine distance is 1 − dot with no per-pair norms (as hnswlib does for
/// inner-product spaces). The loop body holds no calls: a non-inlined call inside it would make the JIT spill
/// the four accumulators to the stack on every iteration.
/// </summary>
internal static class CosineKernel
{
    /// <summary>Sum of a[i]·b[i]. The spans must have the same length (checked in debug builds only: callers are internal).</summary>
    public static float Dot(ReadOnlySpan<float> a, ReadOnlySpan<float> b)
    {
        Debug.Assert(a.Length == b.Length);
        int n = a.Length;
        ref float pa = ref MemoryMarshal.GetReference(a);
        ref float pb = ref MemoryMarshal.GetReference(b);
        int i = 0;
        float sum = 0f;
        if (Vector256.IsHardwareAccelerated && n >= Vector256<float>.Count)
        {
            // Four independent accumulators hide the FMA latency (4 cycles) behind its throughput.
            var acc0 = Vector256<float>.Zero;
            var acc1 = Vector256<float>.Zero;
            var acc2 = Vector256<float>.Zero;
            var acc3 = Vector256<float>.Zero;
            for (; i <= n - 32; i += 32)
            {
                acc0 = Vector256.MultiplyAddEstimate(Vector256.LoadUnsafe(ref pa, (nuint)i), Vector256.LoadUnsafe(ref pb, (nuint)i), acc0);
                acc1 = Vector256.MultiplyAddEstimate(Vector256.LoadUnsafe(ref pa, (nuint)(i + 8)), Vector256.LoadUnsafe(ref pb, (nuint)(i + 8)), acc1);
                acc2 = Vector256.MultiplyAddEstimate(Vector256.LoadUnsafe(ref pa, (nuint)(i + 16)), Vector256.LoadUnsafe(ref pb, (nuint)(i + 16)), acc2);
                acc3 = Vector256.MultiplyAddEstimate(Vector256.LoadUnsafe(ref pa, (nuint)(i + 24)), Vector256.LoadUnsafe(ref pb, (nuint)(i + 24)), acc3);
            }

            for (; i <= n - 8; i += 8)
            {
                acc0 = Vector256.MultiplyAddEstimate(Vector256.LoadUnsafe(ref pa, (nuint)i), Vector256.LoadUnsafe(ref pb, (nuint)i), acc0);
            }

            sum = Vector256.Sum((acc0 + acc1) + (acc2 + acc3));
        }

        for (; i < n; i++)
        {
            sum += Unsafe.Add(ref pa, i) * Unsafe.Add(ref pb, i);
        }

        return sum;
    }

    /// <summary>Cosine distance of two unit vectors: 1 − dot, in [0, 2].</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static float Distance(ReadOnlySpan<float> a, ReadOnlySpan<float> b) => 1f - Dot(a, b);

    /// <summary>Euclidean length of <paramref name="v"/>.</summary>
    public static float Norm(ReadOnlySpan<float> v) => MathF.Sqrt(Dot(v, v));

    /// <summary>Writes <paramref name="source"/> scaled to unit length into <paramref name="destination"/>.</summary>
    /// <exception cref="ArgumentException">The vector is zero or holds NaN/infinity: it has no direction.</exception>
    public static void Normalize(ReadOnlySpan<float> source, Span<float> destination)
    {
        float norm = Norm(source);
        if (!(norm > 0f) || !float.IsFinite(norm))
        {
            ThrowNoDirection(norm);
        }

        TensorPrimitives.Multiply(source, 1f / norm, destination);
    }

    private static void ThrowNoDirection(float norm) =>
        throw new ArgumentException(
            $"The vector has length {norm}: a zero, NaN or infinite vector has no direction, so it cannot be compared by cosine distance. Check the embedding step that produced it.");
}
