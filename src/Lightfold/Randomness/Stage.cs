namespace Lightfold.Randomness;

/// <summary>The pipeline stage a random stream belongs to; part of every stream key.</summary>
/// <remarks>Values are part of the determinism contract: renumbering one changes every catalog.</remarks>
public enum Stage : ulong
{
    /// <summary>Number of events in a realization (one stream per run).</summary>
    EventCount = 1,
    /// <summary>Deflector and source draws of one system.</summary>
    Population = 2,
    /// <summary>Transient properties (peak magnitude, explosion time, model parameters).</summary>
    Transient = 3,
    /// <summary>Dust draws (host and Milky Way extinction).</summary>
    Dust = 4,
    /// <summary>Photometric noise of one system's observations.</summary>
    Noise = 5,
    /// <summary>Source position on a microlensing map.</summary>
    Microlensing = 6,
    /// <summary>Star fields of a microlensing map (keyed by map, not system).</summary>
    StarField = 7,
    /// <summary>Visit schedule generated from a cadence description (keyed by run, not system).</summary>
    Schedule = 8,
    /// <summary>Unlensed comparison objects for training sets.</summary>
    Unlensed = 9,
    /// <summary>Bootstrap resampling in the delay estimator.</summary>
    Bootstrap = 10,
}
