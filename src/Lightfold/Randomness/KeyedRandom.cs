using System.Runtime.CompilerServices;
using MathNet.Numerics;

namespace Lightfold.Randomness;

/// <summary>A random stream keyed by (seed, system id, stage[, substream]): xoshiro256** seeded by SplitMix64.</summary>
/// <remarks>
/// Generator: xoshiro256** of Blackman &amp; Vigna 2021 (ACM TOMS 47, 36, arXiv:1805.01407); its state is
/// filled from a SplitMix64 sequence (Steele, Lea &amp; Flood 2014, OOPSLA) whose start is a hash of the
/// key, so streams of neighbouring keys are unrelated and no draw depends on run order, thread or shard.
/// A mutable struct: pass it by <c>ref</c>; copying it copies the stream position. No draw allocates.
/// </remarks>
public struct KeyedRandom
{
    const ulong Golden = 0x9E3779B97F4A7C15UL;
    ulong s0, s1, s2, s3;
    double spareNormal;
    bool hasSpare;

    /// <summary>The stream for one system and stage.</summary>
    public static KeyedRandom For(ulong seed, long systemId, Stage stage, ulong substream = 0)
    {
        ulong h = Mix(seed + Golden);
        h = Mix(h ^ ((ulong)systemId * Golden + 0x632BE59BD9B4E019UL));
        h = Mix(h ^ ((ulong)stage * 0xD1B54A32D192ED03UL + 0x8CB92BA72F3D8DD7UL));
        h = Mix(h ^ (substream * 0xABC98388FB8FAC03UL + 0x2545F4914F6CDD1DUL));
        var r = new KeyedRandom();
        ulong x = h;
        r.s0 = Mix(x += Golden);
        r.s1 = Mix(x += Golden);
        r.s2 = Mix(x += Golden);
        r.s3 = Mix(x += Golden);
        if ((r.s0 | r.s1 | r.s2 | r.s3) == 0) r.s0 = Golden;   // the one forbidden state
        return r;
    }

    /// <summary>SplitMix64 finaliser (Steele et al. 2014): a bijective 64-bit mix.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static ulong Mix(ulong z)
    {
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Next 64 random bits (xoshiro256**).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public ulong NextUInt64()
    {
        ulong result = ulong.RotateLeft(s1 * 5, 7) * 9;
        ulong t = s1 << 17;
        s2 ^= s0;
        s3 ^= s1;
        s1 ^= s2;
        s0 ^= s3;
        s2 ^= t;
        s3 = ulong.RotateLeft(s3, 45);
        return result;
    }

    /// <summary>Uniform double in [0, 1) with 53 random bits.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    /// <summary>Uniform double in (0, 1): never exactly 0, safe for logarithms.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double NextOpenDouble() => ((NextUInt64() >> 12) + 0.5) * (1.0 / (1UL << 52));

    /// <summary>Uniform double in [min, max).</summary>
    public double Uniform(double min, double max) => min + (max - min) * NextDouble();

    /// <summary>Uniform integer in [0, n), without modulo bias (Lemire 2019, ACM TOMS 29, 1).</summary>
    public int NextInt(int n)
    {
        if (n <= 0) throw new ArgumentOutOfRangeException(nameof(n), n, "must be > 0");
        ulong bound = (ulong)n;
        UInt128 m = (UInt128)NextUInt64() * bound;
        ulong low = (ulong)m;
        if (low < bound)
        {
            ulong threshold = (0UL - bound) % bound;
            while (low < threshold)
            {
                m = (UInt128)NextUInt64() * bound;
                low = (ulong)m;
            }
        }
        return (int)(m >> 64);
    }

    /// <summary>Standard normal deviate (Marsaglia &amp; Bray 1964 polar method; the second value is kept for the next call).</summary>
    public double Normal()
    {
        if (hasSpare)
        {
            hasSpare = false;
            return spareNormal;
        }
        double u, v, s;
        do
        {
            u = 2.0 * NextDouble() - 1.0;
            v = 2.0 * NextDouble() - 1.0;
            s = u * u + v * v;
        } while (s >= 1.0 || s == 0.0);
        double f = Math.Sqrt(-2.0 * Math.Log(s) / s);
        spareNormal = v * f;
        hasSpare = true;
        return u * f;
    }

    /// <summary>Normal deviate with the given mean and standard deviation.</summary>
    public double Normal(double mean, double sigma) => mean + sigma * Normal();

    /// <summary>Exponential deviate with the given mean.</summary>
    public double Exponential(double mean) => -mean * Math.Log(NextOpenDouble());

    /// <summary>Deviate with density ∝ x^index on [min, max] (0 &lt; min &lt; max), by inversion.</summary>
    public double PowerLaw(double index, double min, double max)
    {
        double u = NextDouble();
        if (Math.Abs(index + 1.0) < 1e-12)
            return min * Math.Pow(max / min, u);
        double e = index + 1.0;
        double a = Math.Pow(min, e), b = Math.Pow(max, e);
        return Math.Pow(a + u * (b - a), 1.0 / e);
    }

    /// <summary>Poisson deviate with the given mean.</summary>
    /// <remarks>
    /// Mean &lt; 10: multiplication of uniforms (Knuth, TAOCP vol. 2). Otherwise the transformed
    /// rejection method PTRS of Hörmann 1993 (Insurance: Mathematics and Economics 12, 39).
    /// </remarks>
    public long Poisson(double mean)
    {
        if (!(mean >= 0) || double.IsInfinity(mean)) throw new ArgumentOutOfRangeException(nameof(mean), mean, "must be finite and ≥ 0");
        if (mean == 0) return 0;
        if (mean < 10.0)
        {
            double limit = Math.Exp(-mean), product = NextDouble();
            long k = 0;
            while (product > limit)
            {
                k++;
                product *= NextDouble();
            }
            return k;
        }
        double smu = Math.Sqrt(mean), logMu = Math.Log(mean);
        double b = 0.931 + 2.53 * smu;
        double a = -0.059 + 0.02483 * b;
        double invAlpha = 1.1239 + 1.1328 / (b - 3.4);
        double vr = 0.9277 - 3.6224 / (b - 2.0);
        while (true)
        {
            double u = NextDouble() - 0.5;
            double v = NextDouble();
            double us = 0.5 - Math.Abs(u);
            double kd = Math.Floor((2.0 * a / us + b) * u + mean + 0.43);
            if (us >= 0.07 && v <= vr) return (long)kd;
            if (kd < 0 || (us < 0.013 && v > us)) continue;
            if (Math.Log(v) + Math.Log(invAlpha) - Math.Log(a / (us * us) + b)
                <= -mean + kd * logMu - SpecialFunctions.GammaLn(kd + 1.0))
                return (long)kd;
        }
    }
}
