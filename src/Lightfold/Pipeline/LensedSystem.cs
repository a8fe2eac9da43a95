using Lightfold.Lensing;
using Lightfold.Populations;

namespace Lightfold.Pipeline;

/// <summary>One drawn and solved lensed system (the truth behind a `systems` row and its `images` rows).</summary>
public struct LensedSystem
{
    /// <summary>Capacity of <see cref="Images"/>.</summary>
    public const int MaxImages = ImageFinder.MaxImages;

    /// <summary>Unique id; every random stream of the system is keyed by it.</summary>
    public long SystemId;
    /// <summary>Expected events this row stands for.</summary>
    public double Weight;
    /// <summary>Transient class.</summary>
    public TransientType Type;
    /// <summary>Deflector redshift.</summary>
    public double ZLens;
    /// <summary>Source redshift.</summary>
    public double ZSource;
    /// <summary>Lensing velocity dispersion [km/s].</summary>
    public double SigmaVKms;
    /// <summary>The lens (θ_E, q, PA, γ, shear PA); null for an unlensed object of a training set.</summary>
    public SieShearLens? Lens;
    /// <summary>False for the unlensed objects of a training set.</summary>
    public bool Lensed;
    /// <summary>Source East offset [arcsec].</summary>
    public double SourceXArcsec;
    /// <summary>Source North offset [arcsec].</summary>
    public double SourceYArcsec;
    /// <summary>Explosion time [MJD] (observer frame).</summary>
    public double T0Mjd;
    /// <summary>Peak absolute rest-frame B magnitude.</summary>
    public double PeakAbsoluteBMag;
    /// <summary>D_Δt [Mpc].</summary>
    public double TimeDelayDistanceMpc;
    /// <summary>Images found.</summary>
    public int ImageCount;
    /// <summary>Regular or on a caustic.</summary>
    public ImageSetStatus Status;
    /// <summary>Images ordered by arrival; delays already converted to days in <see cref="DelaysDays"/>.</summary>
    public ImageBuffer Images;
    /// <summary>Delay of each image after the first [days].</summary>
    public DelayBuffer DelaysDays;
    /// <summary>Convergence in stars at each image.</summary>
    public DelayBuffer KappaStars;
    /// <summary>Einstein radius of a 1 M☉ star on the source plane [cm].</summary>
    public double MicroEinsteinRadiusCm;

    /// <summary>Fixed-size inline storage for the images (no allocation per system).</summary>
    [System.Runtime.CompilerServices.InlineArray(MaxImages)]
    public struct ImageBuffer
    {
        LensedImage first;
    }

    /// <summary>Fixed-size inline storage for the delays.</summary>
    [System.Runtime.CompilerServices.InlineArray(MaxImages)]
    public struct DelayBuffer
    {
        double first;
    }
}
