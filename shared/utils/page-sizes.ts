/** Airfields per page in the airfield and briefing lists (a grid of 2 or 3 columns fills evenly); a client may ask up to 100. */
export const AIRFIELD_PAGE_SIZE = 24
