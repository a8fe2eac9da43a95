using System.Collections.Concurrent;

namespace Lightfold.Microlensing;

/// <summary>Where finished maps are kept between runs (the pipeline provides a disk cache; tests may provide none).</summary>
public interface IMapCache
{
    /// <summary>A stored map for <paramref name="spec"/>, if any.</summary>
    bool TryLoad(MapSpec spec, out MagnificationMap map);
    /// <summary>Stores a map.</summary>
    void Save(MagnificationMap map);
}

/// <summary>Sampling of the map bank: map geometry and the (κ, γ, κ_*/κ) grid images are snapped to.</summary>
public sealed record MapBankSettings
{
    /// <summary>Map side [R_E].</summary>
    public double SizeEinsteinRadii { get; init; } = 5;
    /// <summary>Pixels per side.</summary>
    public int Pixels { get; init; } = 250;
    /// <summary>Mean rays per pixel.</summary>
    public double RaysPerPixel { get; init; } = 50;
    /// <summary>Source-plane margin shot around each map [R_E].</summary>
    public double MarginEinsteinRadii { get; init; } = 1;
    /// <summary>Grid step in κ (nodes at step/4 + k step, so no node sits on a critical line κ ± γ = 1).</summary>
    public double KappaStep { get; init; } = 0.1;
    /// <summary>Grid step in γ (nodes at step/2 + k step; with κ's offset no node has κ + γ = 1 or κ − γ = 1).</summary>
    public double GammaStep { get; init; } = 0.1;
    /// <summary>Stellar fractions κ_*/κ of the grid.</summary>
    public IReadOnlyList<double> StarFractions { get; init; } = [0.1, 0.3, 0.6, 1.0];
    /// <summary>Initial mass function.</summary>
    public InitialMassFunction Imf { get; init; } = new();
    /// <summary>Seed of the bank's star fields, independent of the run seed so runs with different seeds share one cached
    /// bank (their sources still sit at different, run-keyed places on the maps).</summary>
    public ulong Seed { get; init; } = 1;
}

/// <summary>A bank of magnification maps over a (κ, γ, κ_*/κ) grid: an image uses the map of the nearest node.</summary>
/// <remarks>Nearest-neighbour rule: κ and γ round to the nearest node of their offset grids, κ_*/κ to the nearest listed
/// fraction; the node's κ_* is that fraction times the node's κ. The micro factor is the map normalised by the node's
/// macro magnification, so it carries the right statistics for the node. Maps are built on first use (thread-safe,
/// once each) and kept in the cache; the node's seed derives from the bank seed and the node.</remarks>
public sealed class MapBank
{
    readonly MapBankSettings settings;
    readonly ulong seed;
    readonly IMapCache? cache;
    readonly ConcurrentDictionary<string, Lazy<MagnificationMap>> maps = new();

    /// <summary>Creates an empty bank (star fields keyed by <see cref="MapBankSettings.Seed"/>).</summary>
    public MapBank(MapBankSettings settings, IMapCache? cache)
    {
        this.settings = settings;
        seed = settings.Seed;
        this.cache = cache;
    }

    /// <summary>Maps built or loaded so far.</summary>
    public int Count => maps.Count;

    /// <summary>The node spec nearest to (κ, γ, κ_*).</summary>
    public MapSpec NodeFor(double kappa, double gamma, double kappaStar)
    {
        double kStep = settings.KappaStep, gStep = settings.GammaStep;
        double kn = Snap(kappa, kStep, kStep / 4), gn = Snap(gamma, gStep, gStep / 2);
        double fraction = kappa > 0 ? kappaStar / kappa : 0;
        double fn = settings.StarFractions.MinBy(f => Math.Abs(f - fraction));
        int ik = (int)Math.Round((kn - kStep / 4) / kStep), ig = (int)Math.Round((gn - gStep / 2) / gStep), jf = settings.StarFractions.ToList().IndexOf(fn);
        return new MapSpec
        {
            Kappa = kn, Gamma = gn, KappaStar = fn * kn,
            SizeEinsteinRadii = settings.SizeEinsteinRadii, Pixels = settings.Pixels, RaysPerPixel = settings.RaysPerPixel,
            MarginEinsteinRadii = settings.MarginEinsteinRadii, Imf = settings.Imf,
            Seed = Randomness.KeyedRandom.Mix(seed ^ Randomness.KeyedRandom.Mix((ulong)(ik * 1_000_003L + ig * 1009L + jf + 7))),
        };
    }

    static double Snap(double v, double step, double offset) => Math.Max(offset, offset + Math.Round((v - offset) / step) * step);

    /// <summary>Largest κ or γ the bank covers; images beyond (faint images deep inside the lens) are not microlensed.</summary>
    public const double MaxKappaOrGamma = 1.5;

    /// <summary>Whether an image with (κ, γ, κ_*) gets a map (κ, γ ≤ <see cref="MaxKappaOrGamma"/> and some stars).</summary>
    public static bool Covers(double kappa, double gamma, double kappaStar)
        => kappa <= MaxKappaOrGamma && gamma <= MaxKappaOrGamma && kappaStar > 0;

    /// <summary>The map of the node nearest to (κ, γ, κ_*), built or loaded on first use.</summary>
    public MagnificationMap Get(double kappa, double gamma, double kappaStar)
    {
        var spec = NodeFor(kappa, gamma, kappaStar);
        return maps.GetOrAdd(spec.CacheKey, _ => new Lazy<MagnificationMap>(() =>
        {
            if (cache is not null && cache.TryLoad(spec, out var stored)) return stored;
            var map = RayShooter.Shoot(spec, threads: 1);
            cache?.Save(map);
            return map;
        }, LazyThreadSafetyMode.ExecutionAndPublication)).Value;
    }
}
