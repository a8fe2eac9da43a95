namespace Lightfold.Pipeline;

/// <summary>Features of one band of one object, from observed photometry only (see <see cref="ObservationSimulator.Features"/>).</summary>
public struct BandFeatures
{
    /// <summary>Visits in the band.</summary>
    public int Visits;
    /// <summary>Visits with S/N above the detection threshold.</summary>
    public int Detections;
    /// <summary>Largest observed flux [nJy].</summary>
    public double PeakFluxNjy;
    /// <summary>Time of that flux [MJD].</summary>
    public double PeakMjd;
    /// <summary>Days from the first detection to the peak.</summary>
    public double RiseDays;
    /// <summary>Days from the peak to the last detection.</summary>
    public double DeclineDays;
    /// <summary>This band minus the next band [mag] at this band's peak.</summary>
    public double ColourToNextBandMag;
}

/// <summary>Observation rows and light-curve summaries of one system; reused from batch to batch (no per-system allocation once grown).</summary>
public sealed class SystemObservations
{
    /// <summary>Rows filled.</summary>
    public int Count;
    /// <summary>Per row: visit time [MJD].</summary>
    public double[] Mjd = new double[256];
    /// <summary>Per row: band index.</summary>
    public int[] Band = new int[256];
    /// <summary>Per row: image index, or −1 for an unresolved blend.</summary>
    public int[] ImageIndex = new int[256];
    /// <summary>Per row: index of the first image of the row's unresolved group (its own index when resolved).</summary>
    public int[] BlendGroup = new int[256];
    /// <summary>Per row: observed flux [nJy].</summary>
    public double[] Flux = new double[256];
    /// <summary>Per row: 1σ flux error [nJy].</summary>
    public double[] FluxErr = new double[256];
    /// <summary>Per row: true flux [nJy].</summary>
    public double[] TrueFlux = new double[256];
    /// <summary>Per row: microlensing magnification factor.</summary>
    public double[] Micro = new double[256];
    /// <summary>Per row: visit depth [mag].</summary>
    public double[] Depth = new double[256];
    /// <summary>Per row: visit seeing [arcsec].</summary>
    public double[] Seeing = new double[256];

    /// <summary>Brightest observed magnitude of each image among its detections (NaN if none).</summary>
    public double[] PeakMag = new double[LensedSystem.MaxImages];
    /// <summary>Band of <see cref="PeakMag"/> (−1 if none).</summary>
    public int[] PeakBand = new int[LensedSystem.MaxImages];
    /// <summary>Whether the detection rule is met.</summary>
    public bool Detected;
    /// <summary>Detections counted (resolved images and unresolved blends).</summary>
    public int Detections;
    /// <summary>Time of the first detection [MJD] (NaN if none).</summary>
    public double FirstDetectionMjd;
    /// <summary>Host-galaxy colour excess drawn for the system [mag].</summary>
    public double HostEbv;
    /// <summary>S/N threshold of a detection (from the rule), for the per-row flag.</summary>
    public double MinSnr = 5;

    /// <summary>Empties the buffer.</summary>
    public void Clear()
    {
        Count = 0;
        Detected = false;
        Detections = 0;
        FirstDetectionMjd = double.NaN;
        HostEbv = 0;
        Array.Fill(PeakMag, double.NaN);
        Array.Fill(PeakBand, -1);
    }

    /// <summary>Index of a new row, growing the arrays when needed.</summary>
    public int Add()
    {
        if (Count == Mjd.Length)
        {
            int n = 2 * Mjd.Length;
            Array.Resize(ref Mjd, n); Array.Resize(ref Band, n); Array.Resize(ref ImageIndex, n); Array.Resize(ref BlendGroup, n);
            Array.Resize(ref Flux, n); Array.Resize(ref FluxErr, n); Array.Resize(ref TrueFlux, n); Array.Resize(ref Micro, n);
            Array.Resize(ref Depth, n); Array.Resize(ref Seeing, n);
        }
        return Count++;
    }
}
