namespace Lightfold.Survey;

/// <summary>One exposure: when, in which band, how deep and with what seeing.</summary>
/// <param name="Mjd">Time [MJD].</param>
/// <param name="Band">Index into the survey's band list.</param>
/// <param name="Depth5SigmaMag">Single-visit 5σ point-source depth [AB mag].</param>
/// <param name="SeeingFwhmArcsec">Seeing FWHM [arcsec].</param>
public readonly record struct Visit(double Mjd, int Band, double Depth5SigmaMag, double SeeingFwhmArcsec);

/// <summary>Where visits come from: a cadence description or an explicit table.</summary>
public interface ISchedule
{
    /// <summary>Appends the visits of system <paramref name="systemId"/>'s field between two times, in time order.</summary>
    void Visits(ulong seed, long systemId, double fromMjd, double toMjd, List<Visit> into);
}

/// <summary>Observing pattern of one band in a cadence description.</summary>
/// <param name="Name">Band name (a built-in band or one loaded from a throughput table).</param>
/// <param name="RevisitDays">Days between visits in this band.</param>
/// <param name="Depth5SigmaMag">Mean single-visit 5σ depth [AB mag].</param>
/// <param name="DepthSigmaMag">Visit-to-visit scatter of the depth [mag].</param>
/// <param name="SeeingMedianArcsec">Median seeing FWHM [arcsec].</param>
/// <param name="SeeingSigmaDex">Log-normal scatter of the seeing [dex].</param>
public sealed record BandCadence(string Name, double RevisitDays, double Depth5SigmaMag, double DepthSigmaMag, double SeeingMedianArcsec, double SeeingSigmaDex);
